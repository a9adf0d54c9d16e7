#description cognitive-neuroscience behavioural results: z and Z statistics from nonparametric and mixed models, p in scientific notation (e, x 10^, × 10−), four-decimal p
2.4 Behavioural results

Reaction times. Median reaction times were longer on incongruent than on congruent trials (Wilcoxon signed-rank test, ⟦z - 4.38 p=eq:1.2e-5|z = 4.38, p = 1.2e-5⟧), and the congruency effect was larger after an incongruent trial than after a congruent one (⟦z - 3.12 p=eq:.0018|Z = 3.12, p = .0018⟧). Sequential slowing after errors was reliable, ⟦z - -1.96 p=eq:.05|Z = −1.96, p = .05⟧, but small.

Accuracy. Error rates were higher for incongruent trials, ⟦t 31 5.27|t(31) = 5.27, {p4}⟧, and there was no speed–accuracy trade-off across participants, ⟦r 30 .11|r(30) = .11, {p4}⟧. Post-error accuracy did not differ from overall accuracy, ⟦t 31 0.97|t(31) = 0.97, {p4}⟧.

Mixed-effects model. In the trial-level model (fitted with lme4, ⟪version 1.1-34⟫), congruency predicted log RT (⟦z - 4.41 p=eq:1.0e-6 bad|z = 4.41, p = 1.0 x 10^-6⟧), as did the previous trial's congruency (⟦z - 3.57 p=eq:3.6e-4|z = 3.57, p = 3.6 × 10−4⟧) and their interaction (⟦z - 2.74|z = 2.74, {p4}⟧). Trial number had a small effect (⟦z - -2.09|z = −2.09, {p}⟧), and block order had none (⟦z - 0.58|z = 0.58, {p}⟧).

ERP-locked behaviour. Participants with larger error-related negativity slowed more after errors, ⟦r 30 -.47|r(30) = −.47, {p}⟧; the relation with the late positivity was weaker, ⟦r 30 -.31 p=eq:.084|r(30) = −.31, p = .084⟧. Source waveforms are shown in ⟪Figure 3F⟫ and ⟪Fig. 4(b)⟫; electrode positions follow the 10–20 system with electrode ⟪Fz⟫ as reference. Participants with a mean RT more than ⟪3 SD⟫ above the group mean were removed ⟪(n = 2)⟫.

Confirmatory test. The preregistered paired comparison of the congruency effect in the two task versions was significant, ⟦t 31 -3.84 p=eq:5.6e-4|t(31) = −3.84, p = 5.6e-4⟧, with a medium-to-large effect ⟦t 31 -2.63|t(31) = −2.63, {p}, dz = {dz}⟧ for the replication block.
