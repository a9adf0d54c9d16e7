#description Markdown report of an invented workplace survey and team experiment: bold labels, results inside parentheses and after semicolons, Hedges' g, omega squared, p <= forms
# Team climate study — results summary

**Sample.** 312 employees from 41 teams responded ⟪(N = 312)⟫. Team sizes ranged from 4 to 14 ⟪(M = 7.6, SD = 2.3)⟫.

## Survey findings

**Psychological safety** was related to reported error disclosure (⟦r 310 .38|*r*(310) = .38, {p}⟧) and to turnover intentions (⟦r 310 -.27|*r*(310) = −.27, {p}⟧); it was unrelated to tenure (⟦r 310 .04|*r*(310) = .04, {p}⟧). Employees in teams led by a newly appointed manager reported lower safety (⟦t 310 -2.84|*t*(310) = −2.84, {p}, Hedges' *g* = {g}⟧), while part-time employees did not differ from full-time employees (⟦t 310 1.21|*t*(310) = 1.21, {p}, Hedges' *g* = {g}⟧).

**Workload.** Perceived workload differed across the four departments (⟦F 3,308 6.77|*F*(3, 308) = 6.77, {p}, ω² = {w2}⟧); it was highest in customer service (Tukey tests, all ⟪*p*s ≤ .02⟫ for the relevant pairs) and lowest in research. Burnout followed workload (⟦F 3,308 3.06|*F*(3, 308) = 3.06, {p}, ω² = {w2}⟧), but job satisfaction did not (⟦F 3,308 1.12 eff=omega-squared:.00|*F*(3, 308) = 1.12, {p}, ω² = .00⟧).

**Remote work.** Remote workers reported less interruption (⟦t 298.4 3.92|*t*(298.4) = 3.92, {p}⟧) and more isolation (⟦t 287.9 4.45|*t*(287.9) = 4.45, {p}⟧); preferences for hybrid arrangements were more common among parents (⟦chi2 2 9.21 N=312|χ²(2, *N* = 312) = 9.21, {p}, *V* = {V}⟧).

## Team experiment

Twenty teams were assigned to a structured debrief after each project and 21 to business as usual.

- Debriefed teams reported higher safety at follow-up (⟦F 1,39 5.33 p=le:.05|*F*(1, 39) = 5.33, *p* ≤ .05, ηp2 = {pes}⟧).
- Error disclosure increased (⟦F 1,39 8.91 p=le:.01|*F*(1, 39) = 8.91, *p* <= .01, ηp2 = {pes}⟧).
- Project delays did not change (⟦F 1,39 0.09 p=ns|*F*(1, 39) = 0.09, n.s.⟧).
- Team cohesion improved (⟦F 1,39 4.02 p=eq:.026 eff=partial-eta-squared:.09 bad|*F*(1, 39) = 4.02, *p* = .026, ηp2 = .09⟧).
- Manager ratings of team performance rose (⟦F 1,39 2.97 p=lt:.05 bad|*F*(1, 39) = 2.97, *p* < .05⟧), a result we had not predicted.
- Absenteeism fell (⟦t 39 2.44 calc=1.44 bad|*t*(39) = 2.44, {p}, *g* = {g}⟧).
- Cohesion changes correlated with safety changes at team level (⟦r 39 .46|*r*(39) = .46, {p}⟧).

*Note.* Survey weights and models were estimated in Mplus ⟪version 8.10⟫; the climate scale is reproduced on ⟪p. 9⟫ of the technical report.
