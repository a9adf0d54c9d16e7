#description structured abstracts and a short results section from an invented clinical trial: dense parenthetical results, abbreviations, mixed p styles
ABSTRACT

Background: Mindfulness-based programmes are widely offered for chronic pain, but few trials compare them with active controls.
Methods: Adults with chronic low back pain ⟪(N = 168)⟫ were randomised to an 8-week mindfulness course or a health-education course ⟪(ISRCTN-style registration 4471-B)⟫.
Results: Pain interference fell more in the mindfulness arm (⟦F 1,162 6.84|F(1, 162) = 6.84, {p}, ηp² = {pes}⟧), as did catastrophising (⟦F 1,162 11.07|F(1, 162) = 11.07, {p}, ηp² = {pes}⟧); pain intensity did not differ (⟦F 1,162 1.92|F(1, 162) = 1.92, {p}, ηp² = {pes}⟧). Benefits were maintained at 6 months (⟦t 161 2.31|t(161) = 2.31, {p}, d = {d}⟧).
Conclusions: Mindfulness reduced the impact of pain more than health education.

RESULTS

Attrition did not differ by arm (18% vs. 21%; ⟦chi2 1 0.24 N=168|χ2(1, N = 168) = 0.24, {p}⟧). Baseline pain interference (⟪M = 6.1, SD = 1.8⟫) was similar across arms (⟦t 166 0.53|t(166) = 0.53, {p}⟧).

Primary outcome. The arm × time interaction for pain interference was significant (⟦F 1,162 6.84|F(1, 162) = 6.84, {p}, ηp² = {pes}⟧); interference decreased in the mindfulness arm (⟦t 81 5.62|t(81) = 5.62, {p}, dz = {dz}⟧) and, to a smaller extent, in the control arm (⟦t 81 2.49|t(81) = 2.49, {p}, dz = {dz}⟧).

Secondary outcomes. Catastrophising (⟦F 1,162 11.07|F(1, 162) = 11.07, {p}⟧), self-efficacy (⟦F 1,162 5.21 p=eq:.012 bad|F(1, 162) = 5.21, p = .012⟧) and sleep disturbance (⟦F 1,162 4.12|F(1, 162) = 4.12, {p2}⟧) improved more with mindfulness; opioid use did not change differentially (⟦chi2 1 1.66 N=142|χ2(1, N = 142) = 1.66, {p}⟧). Adverse events were rare (⟪n = 4⟫ in each arm). Mediation by catastrophising was supported (indirect effect, ⟦z - 2.58|z = 2.58, {p}⟧).

Dose was defined as the number of sessions attended; the pre-specified analysis plan is given on ⟪pp. 12-15⟫ of the protocol.
