#description methods-heavy excerpt from an invented motor-control paper: formulas with r, t, z, F and p as ordinary symbols, chemical formulas, citations and versions, with only a few real results
2. Method

2.1 Participants
Twenty-six right-handed adults took part ⟪(N = 26)⟫; two were excluded for equipment failure, leaving ⟪(n = 24)⟫. Handedness was assessed with a 10-item inventory (⟪M = 78.2, SD = 12.5⟫).

2.2 Apparatus and task
Participants moved a handle around a circular track, ⟪where r = radius⟫ of the track (15 cm). Angular position was sampled at 500 Hz, and velocity was obtained as v = Δθ / Δt, ⟪t = time in seconds⟫ from movement onset. The handle's vertical force ⟪(Fz)⟫ and the horizontal forces ⟪F(x)⟫ and ⟪F(y)⟫ were recorded by a six-axis sensor. Grip surfaces were cleaned with ⟪C2H5OH⟫ and dried; the sensor housing was anodised aluminium ⟪(Al2O3)⟫ coating.

2.3 Analysis
Trajectories were smoothed with a low-pass filter and ⟪z-scores were computed⟫ for each participant's movement times. Outlier trials, defined as ⟪|z| > 3⟫, were removed (0.8% of trials). The learning rate parameter ⟪p = 0.2⟫ of the state-space model was estimated by maximum likelihood. Power analysis followed Tanaka-Reyes (⟪Journal of Made-up Studies, 18(2), 77-94⟫; see ⟪pp. 80-82⟫). Analyses were conducted in MATLAB ⟪R2023b⟫ and ⟪Python 3.11.4⟫ with a custom toolbox (⟪version 4.2.1⟫). We did not engage in ⟪p-hacking⟫: every analysis reported here was specified in advance (⟪OSF page 3⟫).

3. Results
Movement time decreased across the eight training blocks, ⟦F 3.94,90.62 22.15|F(3.94, 90.62) = 22.15, {p}, ηp2 = {pes}⟧, and the decrease was faster for the clockwise direction, ⟦F 3.94,90.62 2.71|F(3.94, 90.62) = 2.71, {p}, ηp2 = {pes}⟧. Path curvature fell in the first two blocks, ⟦t 23 5.36|t(23) = 5.36, {p}, dz = {dz}⟧, and then stabilised, ⟦t 23 0.77|t(23) = 0.77, {p}⟧. Peak grip force was correlated with movement speed, ⟦r 22 .52|r(22) = .52, {p}⟧. The learning rate differed from zero in every participant; at the group level, ⟦z - 4.29 p=lt:.001|z = 4.29, p < .001⟧. Retention after 24 h was good, ⟦t 23 -1.43 p=eq:.083 bad|t(23) = −1.43, p = .083⟧, with no loss relative to the last training block. Trajectory plots are in ⟪Figure 4(b)⟫.
