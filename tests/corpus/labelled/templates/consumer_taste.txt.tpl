#description sensory-science report on invented snack prototypes: flattened subscript df (F1, 44), F < 1 with and without df, p > .10, several bad p values
Results

Liking. Overall liking of the reduced-salt crackers was lower than that of the standard recipe, ⟦F 1,44 5.10|F1, 44 = 5.10, {p}, ηp2 = {pes}⟧, but only for participants who habitually added salt, ⟦F 1,44 4.88|F1,44 = 4.88, {p}, ηp2 = {pes}⟧. The flavour-enhancer variant was liked as much as the standard recipe, ⟦F 1,44 <1|F1, 44 < 1⟧, and there was no effect of serving order, ⟦F - <1|F < 1⟧.

Saltiness. Perceived saltiness decreased with salt content, ⟦F 2,88 27.36|F2, 88 = 27.36, {p}, ηp2 = {pes}⟧, and potassium chloride partly compensated for the reduction, ⟦F 1,44 2.11 p=gt:.10|F1, 44 = 2.11, p > .10⟧. Bitterness ratings were higher for the ⟪KCl⟫ variant, ⟦t 44 3.02|t(44) = 3.02, {p}⟧, and for the variant with yeast extract, ⟦t 44 2.15 p=eq:.18 bad|t(44) = 2.15, p = .18⟧.

Just-about-right scales. The proportion of "too little salt" responses rose from 12% to 39% as salt was reduced, ⟦chi2 2 13.44 N=135|χ2(2, N = 135) = 13.44, {p}⟧. Penalty analysis showed a mean drop in liking of 1.3 points for "too little salt" (⟦t 44 4.61|t(44) = 4.61, {p}⟧).

Purchase intent. Purchase intent followed liking, ⟦r 43 .62|r(43) = .62, {p}⟧, and was slightly higher among women, ⟦t 43 1.69 p=lt:.05 bad|t(43) = 1.69, p < .05⟧. Price sensitivity did not moderate the effect of recipe, ⟦F 2,86 1.51|F2, 86 = 1.51, {p}⟧. Liking of the reduced-salt recipe rose over repeated exposure, ⟦F 3,132 3.15 p=eq:.021 bad|F3, 132 = 3.15, p = .021⟧, with the largest gain between the first and second tasting, ⟦t 44 2.48|t(44) = 2.48, {p}, dz = {dz}⟧.

Sodium was analysed as ⟪NaCl⟫ equivalents; the standard recipe contained 1.8 g per 100 g. Sample preparation followed ⟪ISO 8589⟫. Each panellist ⟪(n = 45)⟫ tasted all samples in a balanced order; the serving scheme is shown in ⟪Fig. 2(a)⟫ and the ballot on ⟪p. 31⟫.
