#description Markdown registered-report replication: confirmatory and exploratory lists, Welch df, p values sitting on rounding boundaries, software in inline code
## 3. Confirmatory analyses

All hypotheses were tested at α = .05 (two-tailed) as preregistered; the sampling plan stopped at ⟪N = 96⟫.

1. **H1 (original effect).** Persistence on the unsolvable anagrams was shorter after the depleting task, ⟦t 45.3 2.05|*t*(45.3) = 2.05, {p}, *d* = {d}⟧ (Welch test; the original study reported ⟦t 58 2.86 p=eq:.006|*t*(58) = 2.86, *p* = .006⟧).
2. **H2 (moderation by task order).** The effect depended on task order, ⟦F 1,40 4.10 p=eq:.05|*F*(1, 40) = 4.10, *p* = .05⟧, which we treat as significant because the exact value is below .05.
3. **H3 (dose).** Persistence declined across the three depletion doses, ⟦F 2,44 3.27 p=eq:.048 eff=partial-eta-squared:.13|*F*(2, 44) = 3.27, *p* = .048, η²p = .13⟧, and the linear contrast was reliable, ⟦t 30 2.04 p=lt:.05|*t*(30) = 2.04, *p* < .05⟧.
4. **H4 (self-reported fatigue).** Fatigue ratings were higher after depletion, ⟦t 41 2.02 p=eq:.050|*t*(41) = 2.02, *p* = .050⟧.

> Deviation from the plan: the preregistered exclusion rule removed more participants than expected ⟪(n = 7)⟫, so H3 was tested on a subsample.

## 4. Exploratory analyses

- Trait self-control moderated the depletion effect, ⟦F 1,92 5.48|*F*(1, 92) = 5.48, {p}, η²p = {pes}⟧.
- Glucose intake before the session did not, ⟦F 1,92 0.06|*F*(1, 92) = 0.06, {p}, η²p = {pes}⟧.
- Persistence and fatigue were correlated, ⟦r 94 -.23|*r*(94) = −.23, {p}⟧.
- The second depleting task produced a smaller effect, ⟦t 30 2.03 p=lt:.05 bad|*t*(30) = 2.03, *p* < .05⟧, than the first.
- A gender difference in persistence, ⟦t 94 2.22 p=eq:.014 bad|*t*(94) = 2.22, *p* = .014⟧, was not predicted.
- Participants who guessed the hypothesis ⟪(n = 11)⟫ persisted as long as the others, ⟦t 94 -0.41|*t*(94) = −0.41, {p}⟧.
- Anagram difficulty ratings differed across the three lists, ⟦chi2 4 10.36 N=96|χ²(4, N = 96) = 10.36, {p}⟧.
- Session time of day was unrelated to persistence, ⟦F 3,92 1.09|*F*(3, 92) = 1.09, {p}⟧.

All analyses were run with `pwr` (⟪version 1.3-0⟫) and `afex` in ⟪R 4.3.1⟫; the materials are listed on ⟪p. 7⟫ of the Stage 1 protocol.
