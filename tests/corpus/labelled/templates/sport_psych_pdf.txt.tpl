#description second PDF extraction (sport psychology): narrow column wraps that split results at every point, soft hyphens lost, en dash and Unicode minus, F[1, 44] and η2 without p subscript
Results
Pre-performance anxiety. Cognitive anxiety was high-
er before competition than before training, ⟦t 43 4.27|t(43)
= 4.27, {p}, dz = {dz}⟧, and somatic anxiety showed
the same pattern, ⟦t 43 3.18|t(43) = 3.18, {p}, dz =
{dz}⟧. Self-conﬁdence did not change, ⟦t 43 -1.06|t(43) =
−1.06, {p}⟧. A 2 (setting) × 2 (sport type: indi-
vidual, team) ANOVA on cognitive anxiety gave a
main effect of setting, ⟦F 1,42 17.90 p=lt:.001|F(1, 42) = 17.90, p
< .001, ηp2 = {pes}⟧, and an interaction, ⟦F 1,42 4.66|F(1,
42) = 4.66, {p}, ηp2 = {pes}⟧, such that individual-sport
athletes were more affected. The main effect of
sport type was not signiﬁcant, ⟦F 1,42 0.31|F[1, 42] = 0.31, {p}⟧.

Imagery intervention. Athletes in the imagery
group reported larger reductions in cognitive an-
xiety than controls, ⟦F 1,42 6.15|F[1, 42] = 6.15, {p},
η2 = {es}⟧, and larger gains in self-conﬁdence, ⟦F 1,42 5.02 p=eq:.003 eff=eta-squared:.11 bad|F[1, 42]
= 5.02, p = .003, η2 = .11⟧. Performance ratings by coaches
improved in both groups (⟦t 21 2.64|t(21) = 2.64, {p}⟧ and ⟦t 21 2.22|t(21) =
2.22, {p}⟧, respectively), and the group diﬀerence
was not reliable, ⟦t 42 0.58|t(42) = 0.58, {p}⟧. Changes in
anxiety and performance were correlated, ⟦r 42 -.37|r(42)
= –.37, {p}⟧.

Follow-up. At the 3-month follow-up ⟪(n = 38)⟫,
the imagery group still reported lower anxiety, ⟦t 36 2.08 p=eq:.022 bad|t(36)
= 2.08, p = .022⟧, but the difference in conﬁdence had
disappeared, ⟦t 36 0.94|t(36) = 0.94, {p}⟧. Adherence to
the imagery script (logged in the app, ⟪version 2.3⟫)
predicted the anxiety reduction, ⟦r 20 -.48|r(20) = −.48,
{p}⟧, and the athletes who practised daily were
more likely to report a personal best, ⟦chi2 1 4.71 N=44|χ2(1, N =
44) = 4.71, {p}⟧. Item-level results are shown in
⟪Figure 2F⟫ and ⟪Table S4⟫.
