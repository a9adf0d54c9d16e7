#description behavioural-ecology style results from an invented foraging experiment with captive birds: old-style F2,57 subscripts, Unicode minus, chi-square goodness of fit, z from GLMMs, p = .05 boundary
RESULTS

Patch choice. Birds preferred the rich patch in 71% of first visits, more than expected by chance (⟦chi2 1 11.56 N=68|χ2(1, N = 68) = 11.56, {p}⟧). The preference was stronger in the predator-cue treatment, as shown by the treatment term of the binomial GLMM (⟦z - 2.63|z = 2.63, {p}⟧); neither sex (⟦z - 0.44|z = 0.44, {p}⟧) nor body mass (⟦z - -1.30|z = −1.30, {p}⟧) predicted choice.

Giving-up times. Giving-up times differed across the three patch qualities (⟦F 2,57 4.21|F2,57 = 4.21, {p}⟧) and were shorter under predation risk (⟦F 1,57 9.36|F1,57 = 9.36, {p}⟧); the interaction was not significant (⟦F 2,57 1.74|F2,57 = 1.74, {p}⟧). With the outlying bird excluded, the patch effect was similar (⟦F 2,56 3.98 p=eq:.024|F2,56 = 3.98, p = .024⟧).

Vigilance. Scanning rate increased under predation risk (⟦t 19 4.90|t19 = 4.90, {p}⟧; paired test, one bird per aviary) and was negatively related to intake rate (⟦r 18 -.52|r18 = −.52, {p}⟧). Head-up bouts were longer in the open than in the covered patch (⟦t 19 2.09 p=eq:.05|t19 = 2.09, p = .05⟧), a borderline difference.

Social effects. Birds tested with a companion ⟪(n = 10)⟫ fed longer than birds tested alone ⟪(n = 10)⟫, ⟦t 18 2.55 p=eq:.01 bad|t18 = 2.55, p = .01⟧; the proportion of aggressive displacements did not depend on rank (⟦chi2 2 2.14 N=40 p=eq:.015 bad|χ2(2, N = 40) = 2.14, p = .015⟧). Dominant birds had higher intake (⟦F 1,18 7.04|F1,18 = 7.04, {p}⟧), and dominance rank correlated with wing length (⟦r 18 .44 p=eq:.025 bad|r18 = .44, p = .025⟧).

Seasonal comparison. Intake in winter trials exceeded that in autumn trials (⟦t 19 3.37|t19 = 3.37, {p}⟧), and the seasonal difference in giving-up time approached significance (⟦F 1,57 3.61 p=lt:.05 bad|F1,57 = 3.61, p < .05⟧). The distribution of first choices over the four feeder positions did not depart from uniform (⟦chi2 3 3.02 N=68|χ2(3, N = 68) = 3.02, {p}⟧).

Ring numbers and aviary layout are listed in ⟪Table 1⟫ and shown in ⟪Figure 1F⟫. Seed mixtures were supplemented with ⟪CaHPO4⟫. Models were fitted in ⟪R 4.3.1⟫ (lme4 ⟪version 1.1-35⟫); for the analysis strategy see Moreau-Sandoval (⟪pp. 140-152⟫).
