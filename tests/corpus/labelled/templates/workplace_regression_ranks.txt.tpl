#description workplace survey with regressions and rank tests: R² before and after the model F, adjusted R², ΔR² of a step, Kruskal-Wallis H, Spearman's rs written rs, r_s, ρ and as Spearman's r, r without df but with n after it, look-alikes (heritability H2, entropy H(X), a rho parameter)
Results

Engagement was regressed on autonomy, workload and tenure. The model was significant, R² = .12, ⟦F 3,96 4.36 pre=r-squared:.12|F(3, 96) = 4.36, {p}⟧. Adding team climate in a second model raised the explained variance, R² = .20, adjusted R² = .17, ⟦F 4,115 7.19 pre=r-squared:.20 pre=adjusted-r-squared:.17|F(4, 115) = 7.19, {p}⟧; the step itself added ⟪ΔR² = .05⟫, ⟦F 1,95 5.40|F(1, 95) = 5.40, {p}⟧. In the pilot sample, the two-predictor model gave ⟦F 2,57 4.21 eff=r-squared:.13|F(2, 57) = 4.21, {p}, R² = .13⟧. The first model's fit was later quoted in the staff newsletter as R² = .09, ⟦F 3,96 4.36 pre=r-squared:.09 bad|F(3, 96) = 4.36, {p}⟧, which is the adjusted value.

Because workload ratings were skewed, departments were compared with Kruskal-Wallis tests. Workload differed between the three sites, ⟦chi2 2 9.84|H(2) = 9.84, {p}⟧, but not between the four shift patterns, ⟦chi2 3 4.10 N=120|H(3, N = 120) = 4.10, {p}⟧. An earlier draft gave the site comparison of overtime as ⟦chi2 2 5.10 p=eq:.008 bad|H(2) = 5.10, p = .008⟧.

Rank correlations were used for the ordinal items. Autonomy and engagement were related, ⟦r 58 .32|rs(58) = .32, {p}⟧, as were workload and exhaustion, ⟦r 28 -.41|r_s(28) = −.41, {p}⟧, and climate and trust, ⟦r 48 .35|ρ(48) = .35, {p}⟧. Spearman's correlation between tenure and engagement was small, ⟦r 40 .29|r(40) = .29, {p}⟧. In the follow-up survey, engagement and retention intentions correlated, ⟦r 88 .30|r = .30, {p}, n = 90⟧.

Note. Broad-sense heritability figures from the twin literature (⟪H2 = .45⟫) and the entropy of the rota, ⟪H(X) = 2.3⟫ bits, are given for context only; the simulation fixed ⟪rho = 0.9⟫ throughout.
