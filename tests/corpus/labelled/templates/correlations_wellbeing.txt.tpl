#description wellbeing survey with many correlations: r(48) with df, r without df and N stated, a whitespace-aligned text table with one correlation per row, Unicode minus
Results

Correlations among the study variables are reported below for the full sample ⟪(N = 50)⟫. Life satisfaction correlated positively with gratitude, ⟦r 48 .32|r(48) = .32, {p}⟧, and with perceived social support, ⟦r 48 .51|r(48) = .51, {p}⟧, and negatively with loneliness, ⟦r 48 -.46|r(48) = −.46, {p}⟧. Daily screen time was unrelated to life satisfaction, ⟦r 48 -.08|r(48) = −.08, {p}⟧.

Table 3
Zero-order correlations with life satisfaction (two-tailed)

  Predictor               Statistic              p
  Gratitude               ⟦r 48 .32 p=eq:.023|r(48) = .32            p = .023⟧
  Social support          ⟦r 48 .51 p=lt:.001|r(48) = .51            p < .001⟧
  Loneliness              ⟦r 48 -.46 p=lt:.001|r(48) = −.46           p < .001⟧
  Sleep quality           ⟦r 48 .29 p=eq:.041|r(48) = .29            p = .041⟧
  Physical activity       ⟦r 48 .18 p=eq:.211|r(48) = .18            p = .211⟧
  Screen time             ⟦r 48 -.08 p=eq:.581|r(48) = −.08           p = .581⟧

Note. ⟪M = 3.4, SD = 1.2⟫ for life satisfaction on a 1–5 scale.

In the second sample, which completed the measures online (N = 212), gratitude again correlated with life satisfaction, ⟦r - .27 N=212|r = .27, {p}⟧, as did sleep quality, ⟦r - .19 N=212|r = .19, {p}⟧, and loneliness, ⟦r - -.41 N=212|r = −.41, {p}⟧. The correlation between gratitude and social support was also replicated (⟦r 210 .36|r(210) = .36, {p}⟧). A Fisher test showed that the gratitude correlation did not differ between samples, ⟦z - 0.35|z = 0.35, {p}⟧. The sleep-quality correlation in the first sample was described in our preregistration as "moderate" (⟦r 48 .29 p=eq:.004 bad|r(48) = .29, p = .004⟧), which was an error in that document.

Loneliness scores were converted to z-scores before analysis; ⟪z-scores were computed⟫ within sample. Readers worried about ⟪p-hacking⟫ can consult the preregistration, which lists all 14 planned correlations. Nonresponse was low ⟪(n = 3)⟫.
