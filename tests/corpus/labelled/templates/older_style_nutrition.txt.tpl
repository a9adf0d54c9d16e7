#description older typewriter-era nutrition report: no spaces around operators, threshold p values, n.s., X2 for chi-square, r without df
RESULTS

Energy intake at the test meal. Subjects given the high-fibre preload ate less at the ad libitum meal than did controls (⟦F 1,44 6.31 p=lt:.05|F(1,44)=6.31, p<.05⟧), whereas the sweetness of the preload had no effect (⟦F 1,44 0.89 p=ns|F(1,44)=0.89, n.s.⟧). Meal duration differed among the three portion-size conditions (⟦F 2,66 8.14 p=lt:.001|F(2,66)=8.14, p<.001⟧), and there was a tendency for the fibre effect to depend on portion size (⟦F 2,66 2.97 p=lt:.10|F(2,66)=2.97, p<.10⟧).

Hunger ratings. Hunger before the meal was lower after the fibre preload in the lean group (⟦t 22 2.87 p=lt:.01|t(22)=2.87, p<.01⟧) but not in the overweight group (⟦t 22 1.42 p=ns|t(22)=1.42, n.s.⟧). Across all subjects, pre-meal hunger predicted subsequent intake (⟦r - .41 N=48 p=lt:.01|r=.41, p<.01⟧); fullness did not (⟦r - -.22 N=48 p=ns|r=-.22, n.s.⟧). All 48 subjects completed both sessions.

Food choice. More subjects chose the low-energy dessert after the fibre preload (⟦chi2 1 4.2 N=90 p=lt:.05|X2(1, N = 90) = 4.2, p<.05⟧), and choices differed across the three dessert categories offered (⟦chi2 2 11.62 p=lt:.01|X2(2)=11.62, p<.01⟧).

Palatability. Rated pleasantness of the test meal was lower after the fibre preload (⟦F 1,44 7.95 p=le:.01|F(1,44)=7.95, p <= .01⟧) and declined across the meal (⟦t 45 2.79 p=le:.01|t(45)=2.79, p ≤ .01⟧). The apparent effect of time of day (⟦F 1,44 3.02 p=lt:.05 bad|F(1,44)=3.02, p<.05⟧) should be treated with caution, as should the difference between the morning and evening groups in thirst (⟦t 22 2.01 p=lt:.01 bad|t(22)=2.01, p<.01⟧). Energy density of the four test foods differed (⟦F 3,88 4.66 p=lt:.01|F(3,88)=4.66, p<.01⟧).

Calcium intake was estimated from the analysed ⟪CaCO3⟫ content of the supplement and the food-composition tables of Brandt and Oyelaran (⟪Journal of Made-up Studies, 12(3), 45-67⟫; see especially ⟪pp. 4-9⟫ of their appendix). The replication sample is described as ⟪Study 2 (t2)⟫ below, and the pilot sample ⟪(n = 24)⟫ is not analysed here.
