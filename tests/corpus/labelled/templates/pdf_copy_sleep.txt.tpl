#description PDF copy-paste of a two-column sleep-science article: hard line wraps, hyphenation, ligatures, flattened subscripts, results split over lines
3.2 Sleep restriction and vigilance
Across the ﬁve nights of restriction, lapses on the
psychomotor vigilance task increased steadily (see
⟪Figure 4F⟫), a linear trend conﬁrmed by the re-
peated-measures ANOVA, ⟦F 4,164 9.83|F4,164 = 9.83, {p},
ηp2 = {pes}⟧. Sphericity was violated (ε = .61), and
the Greenhouse–Geisser corrected test gave the same
conclusion, ⟦F 2.44,100.04 9.83|F(2.44, 100.04) = 9.83, {p}⟧. The
group (restricted vs. control) by night interaction
was also reliable, ⟦F 4,164 3.52|F4, 164 = 3.52, {p}, ηp2 = {pes}⟧,
indicating that the decline was conﬁned to the re-
stricted group. Mean reaction time showed the same
pattern for group, ⟦F 1,41 12.40|F(1,
41) = 12.40, {p}, ηp2 = {pes}⟧, but the
interaction for reaction time was not signiﬁcant,
⟦F 4,164 1.22|F(4, 164) = 1.22, {p}, ηp2 = {pes}⟧.

3.3 Subjective sleepiness
Karolinska sleepiness ratings (KSS) rose from the
ﬁrst to the last night in the restricted group, ⟦t 21 5.08|t(21)
= 5.08, {p}, dz = {dz}⟧, but not in controls, ⟦t 20 1.31|t(20) =
1.31, {p}⟧. Ratings were correlated with lapses on the
ﬁnal night, ⟦r 41 .44|r(41) = .44, {p}⟧, though not at base-
line, ⟦r 41 .09|r(41) = .09, {p}⟧. The sample sizes per cell are
given in Table 2 ⟪(n = 22)⟫ and ⟪(n = 21)⟫ respectively.

3.4 Actigraphy
Total sleep time recorded by wrist actigraphs (ﬁrm-
ware ⟪version 4.2.1⟫) agreed with diary entries, ⟦r 41 .71|r(41)
= .71, {p}⟧. Sleep efﬁciency was lower in the restricted
group, ⟦t 41 -3.66|t(41) = −3.66, {p}, d = {d}⟧, and wake after sleep
onset was higher, ⟦t 41 2.87|t(41) = 2.87, {p}, d = {d}⟧. Nap-
ping on the recovery day did not differ between
groups, ⟦chi2 1 0.62 N=43|χ2(1, N = 43) = 0.62, {p}⟧. A sex × group inter-
action for sleep onset latency emerged, ⟦F 1,39 4.47 calc=4.74 bad|F1,39 = 4.47,
{p}⟧, but did not survive correction for multiple
comparisons. Nightly recovery slopes were estimated
in ⟪R 4.3.1⟫ with random intercepts for participants;
the slope differed from zero, ⟦z - 3.94|z = 3.94, {p}⟧, and from
the control slope, ⟦z - 2.18|z = 2.18, {p}⟧.
