#description Markdown working paper from an invented school-based reading intervention: headings, bullet lists, Hedges' g and Welch t tests with CIs
# Effects of a peer-tutoring programme on reading fluency

## 4. Results

### 4.1 Baseline equivalence

Tutored and comparison classrooms did not differ at baseline in words read correctly per minute, ⟦t 46.8 0.74|*t*(46.8) = 0.74, {p}⟧, or in vocabulary, ⟦t 51.2 -0.35|*t*(51.2) = −0.35, {p}⟧ (Welch tests; see ⟪Table 1⟫ and ⟪Figure 1(a)⟫).

### 4.2 Main outcomes

- **Fluency.** Tutored pupils gained more words per minute than comparison pupils, ⟦t 52.6 3.08 eff=hedges-g:0.81|*t*(52.6) = 3.08, {p}, Hedges' *g* = 0.81, 95% CI [0.27, 1.35]⟧.
- **Comprehension.** The gain in comprehension favoured the tutored group, ⟦t 54 2.27|*t*(54) = 2.27, {p}, *g* = {g}, 95% CI {dci}⟧.
- **Motivation.** Reading motivation did not change, ⟦t 54 1.05|*t*(54) = 1.05, {p}, *g* = {g}⟧.
- **Spelling.** A small advantage was observed, ⟦t 54 2.05 p=eq:.045 eff=hedges-g:0.54|*t*(54) = 2.05, *p* = .045, *g* = 0.54⟧.

The effect of the programme on fluency held in a multilevel model with pupils nested in classrooms, ⟦z - 2.81|*z* = 2.81, {p}⟧, and the classroom-level variance was small ⟪(ICC = .06)⟫.

### 4.3 Moderators

A 2 (condition) × 2 (pupil role: tutor, tutee) ANOVA on fluency gains showed main effects of condition, ⟦F 1,52 9.64|*F*(1, 52) = 9.64, {p}, partial η2 = {pes}⟧, and role, ⟦F 1,52 4.43|*F*(1, 52) = 4.43, {p}, partial η2 = {pes}⟧, but no interaction, ⟦F 1,52 0.52|*F*(1, 52) = 0.52, {p}, partial η2 = {pes}⟧. Gains were unrelated to baseline fluency, ⟦r 54 -.12|*r*(54) = −.12, {p}⟧, and to attendance, ⟦r 54 .21 p=eq:.06 bad|*r*(54) = .21, *p* = .06⟧.

### 4.4 Teacher ratings

| Outcome | Tutored | Comparison |
|---|---|---|
| Engagement | 3.9 (0.7) | 3.4 (0.8) |
| Behaviour | 4.1 (0.6) | 4.0 (0.6) |

Teachers rated tutored pupils as more engaged, ⟦t 54 2.53|*t*(54) = 2.53, {p}, *d* = {d}⟧, but not as better behaved, ⟦t 54 0.48|*t*(54) = 0.48, {p}, *d* = {d}⟧. Follow-up at six months ⟪(n = 49)⟫ showed the fluency advantage persisting, ⟦t 47 2.29 calc=1.29 bad|*t*(47) = 2.29, {p}⟧.

*Note.* Analyses used the **lme4** package (⟪version 1.1-35⟫) in ⟪R 4.3.1⟫; the tutoring manual is cited as Okafor and Lindqvist (2019, ⟪pp. 33–41⟫).
