#description plain-text ANOVA summary tables pasted from a word processor: whitespace-aligned rows, one effect per row, with a few tables that hold no statistic symbols
Table 2
Mixed ANOVA on recall accuracy (Experiment 1)

  Effect                      Test                          p        ηp2
  Encoding task               ⟦F 1,58 14.62|F(1, 58) = 14.62         {p}    {pes_}⟧
  List length                 ⟦F 2,116 31.05|F(2, 116) = 31.05        {p}    {pes_}⟧
  Delay                       ⟦F 1,58 3.44|F(1, 58) = 3.44          {p}    {pes_}⟧
  Task × Length               ⟦F 2,116 4.18|F(2, 116) = 4.18         {p}    {pes_}⟧
  Task × Delay                ⟦F 1,58 0.71|F(1, 58) = 0.71          {p}    {pes_}⟧
  Length × Delay              ⟦F 2,116 2.66 p=eq:.047 bad|F(2, 116) = 2.66         p = .047    .04⟧
  Task × Length × Delay       ⟦F - <1 p=ns|F < 1                         n.s.       –⟧

Note. Rows are ordered as in the preregistration (see ⟪p. 3⟫ of the supplement).

Table 3
Descriptive statistics (proportion correct)

  Condition          Short lists      Long lists
  Deep encoding      .82 (.09)        .71 (.11)
  Shallow encoding   .74 (.10)        .58 (.13)

Note. Values are M (SD); ⟪(n = 30)⟫ per encoding group.

Table 4
Follow-up comparisons (Experiment 2, ⟪N = 64⟫)

  Comparison                       Statistic                       p          d
  Deep vs. shallow, short lists    ⟦t 62 2.41|t(62) = 2.41                  {p}       d = {d}⟧
  Deep vs. shallow, long lists     ⟦t 62 3.86|t(62) = 3.86                  {p}       d = {d}⟧
  Short vs. long, deep             ⟦t 31 4.75|t(31) = 4.75                  {p}       dz = {dz}⟧
  Short vs. long, shallow          ⟦t 31 5.90|t(31) = 5.90                  {p}       dz = {dz}⟧
  Recognition vs. recall           ⟦t 62 1.99 p=eq:.025 eff=cohens-d:0.50 bad|t(62) = 1.99                  p = .025      d = 0.50⟧

Table 5
Tests of the association between strategy report and accuracy

  Strategy          Test                                 p
  Imagery           ⟦chi2 1 6.10 N=64|χ2(1, N = 64) = 6.10           {p}⟧
  Rehearsal         ⟦chi2 1 0.94 N=64|χ2(1, N = 64) = 0.94           {p}⟧
  Grouping          ⟦chi2 2 7.81 N=64|χ2(2, N = 64) = 7.81           {p}⟧

Note. The last column of Table 2 gives partial eta squared. Panel layout as in ⟪Figure 2F⟫; the stimulus lists are those of ⟪Table S1(b)⟫.
