#description APA 7 results section of an invented social-cognition experiment: one paragraph per line, regular spacing, CIs for effect sizes
Results

Preliminary Analyses

Of the 124 students who signed up, four failed the attention check; the final sample ⟪(N = 120)⟫ was 63% female and had a mean age of 20.8 years. Participants in the warmth-prime condition rated the target as warmer (⟪M = 5.12, SD = 1.04⟫) than those in the neutral condition (M = 4.47, SD = 1.11), ⟦t 118 3.31|t(118) = 3.31, {p}, d = {d}, 95% CI {dci}⟧, so the manipulation worked as intended.

Primary Analyses

A 2 (prime: warmth, neutral) × 3 (target: in-group, out-group, unspecified) mixed-design ANOVA on helping intentions revealed a main effect of prime, ⟦F 1,118 10.96|F(1, 118) = 10.96, {p}, ηp2 = {pes}, 90% CI {pesci}⟧, no main effect of target, ⟦F 2,236 1.43|F(2, 236) = 1.43, {p}, ηp2 = {pes}⟧, and the predicted Prime × Target interaction, ⟦F 2,236 5.87|F(2, 236) = 5.87, {p}, ηp2 = {pes}, 90% CI {pesci}⟧ (see ⟪Figure 2F⟫ for the cell means).

Simple-effects tests showed that the prime increased helping toward the out-group target, ⟦t 118 2.94|t(118) = 2.94, {p}, d = {d}⟧, but not toward the in-group target, ⟦t 118 0.61|t(118) = 0.61, {p}, d = {d}⟧, or the unspecified target, ⟦t 118 -1.12|t(118) = -1.12, {p}, d = {d}⟧. Planned contrasts within the warmth condition replicated this pattern (⟦t 59 2.48|t(59) = 2.48, {p}, dz = {dz}⟧).

The proportion of participants who volunteered for a second session was higher after the warmth prime (41%) than after the neutral prime (23%), ⟦chi2 1 4.53 N=120|χ2(1, N = 120) = 4.53, {p}, φ = {phi}⟧. Volunteering correlated with helping intentions, ⟦r 118 .27|r(118) = .27, {p}⟧, and, weakly and negatively, with self-reported hurry, ⟦r 118 -.19|r(118) = -.19, {p}⟧.

Covariate Analyses

Controlling for trait agreeableness, the effect of prime remained, ⟦F 1,116 7.32|F(1, 116) = 7.32, {p}, ηp2 = {pes}⟧, whereas agreeableness itself did not predict helping, ⟦F 1,116 0.84|F(1, 116) = 0.84, {p}, ηp2 = {pes}⟧. The three-way interaction with participant gender was small, ⟦F 2,232 3.12 phalf bad|F(2, 232) = 3.12, {p}, ηp2 = {pes}⟧, and we do not interpret it further (cf. the caution in Halvorsen & Quint, 2016, ⟪p. 12⟫).

Exploratory Analyses

Women reported more empathic concern than men, ⟦t 118 2.12 p=eq:.004 eff=cohens-d:0.39 bad|t(118) = 2.12, p = .004, d = 0.39⟧, although this difference did not moderate the prime effect, ⟦F 1,116 1.97|F(1, 116) = 1.97, {p}⟧. Response times on the lexical decision task are shown in ⟪Fig. 3(b)⟫.
