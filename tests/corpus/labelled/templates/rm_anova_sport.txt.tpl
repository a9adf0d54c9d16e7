#description sport-science repeated-measures report: Greenhouse-Geisser and Huynh-Feldt corrected df, generalized eta squared, en dash and Unicode minus signs
Results

Sprint performance. Mauchly's test indicated that sphericity was violated for the fatigue factor (W = 0.41), so Greenhouse–Geisser corrections were applied (ε = 0.54). Mean 20-m sprint time slowed across the four repeated-sprint sets, ⟦F 1.62,45.36 3.87 eff=generalized-eta-squared:.05|F(1.62, 45.36) = 3.87, {p}, η²G = .05⟧, and the slowing was larger in the hot condition, ⟦F 1.71,47.88 6.02 eff=generalized-eta-squared:.04|F(1.71, 47.88) = 6.02, {p}, η²G = .04⟧. The main effect of environment was large, ⟦F 1,28 21.36 eff=generalized-eta-squared:.11|F(1, 28) = 21.36, {p}, η²G = .11⟧.

Countermovement jump. Jump height decreased after the protocol, ⟦F 2.31,64.68 11.49|F(2.31, 64.68) = 11.49, {p}, ηp2 = {pes}⟧ (Huynh–Feldt ε = 0.77), with no environment × time interaction, ⟦F 2.31,64.68 0.93|F(2.31, 64.68) = 0.93, {p}, ηp2 = {pes}⟧. Post hoc comparisons showed a decline from pre to post (⟦t 28 -4.12|t(28) = −4.12, {p}, dz = {dz}⟧) and a partial recovery from post to 24 h (⟦t 28 2.64|t(28) = 2.64, {p}, dz = {dz}⟧), whereas the pre to 24 h contrast was not reliable (⟦t 28 -1.58|t(28) = –1.58, {p}, dz = {dz}⟧).

Physiological responses. Core temperature at the end of exercise was higher in the heat, ⟦t 28 9.71|t(28) = 9.71, {p}⟧, and heart rate tracked core temperature within participants, ⟦r 27 .58|r(27) = .58, {p}⟧. Blood lactate rose across sets, ⟦F 1.48,41.44 38.20|F(1.48, 41.44) = 38.20, {p}, ηp2 = {pes}⟧. Rating of perceived exertion did not differ between environments in the first set, ⟦t 28 -0.88|t(28) = −0.88, {p}⟧, but did in the last, ⟦t 28 -2.41 phalf bad|t(28) = −2.41, {p}⟧.

Sex differences. Women slowed less than men across sets, ⟦F 1.62,42.12 4.58 eff=partial-eta-squared:.32 bad|F(1.62, 42.12) = 4.58, {p}, ηp2 = .32⟧, a result we consider preliminary given the group sizes ⟪(n = 12 women, n = 17 men)⟫. Session order had no effect, ⟦F - <1|F < 1⟧.

Timing gates (⟪version 2.0.3⟫ firmware) were placed at 0, 10 and 20 m; sprint velocity was computed as v = d / t, ⟪where t = time in seconds⟫ between gates. Heat acclimation state is summarised in ⟪Table 2 (panel F)⟫. Data were analysed in ⟪R 4.2.2⟫.
