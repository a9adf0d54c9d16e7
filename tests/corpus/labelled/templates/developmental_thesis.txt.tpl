#description doctoral-thesis chapter in developmental psychology: long paragraphs, SPSS-style p = .000, words for effect sizes ("partial eta squared"), η2p order, p = 0.021 with leading zero
CHAPTER 4: RESULTS OF STUDY 2

4.1 Theory-of-mind performance

A 3 (age group: 3, 4 and 5 years) × 2 (task: false belief, diverse desire) mixed ANOVA was conducted on the number of correct answers. The main effect of age group was significant, ⟦F 2,87 19.72 p=eq:.000|F(2, 87) = 19.72, p = .000, partial eta squared = {pes}⟧, as was the main effect of task, ⟦F 1,87 33.05 p=eq:.000|F(1, 87) = 33.05, p = .000, partial eta squared = {pes}⟧. The interaction between age group and task was also significant, ⟦F 2,87 4.31|F(2, 87) = 4.31, {p0}, partial eta squared = {pes}⟧. To follow up this interaction, separate one-way ANOVAs were carried out for each task. For false-belief items there was a clear effect of age, ⟦F 2,87 21.40|F(2, 87) = 21.40, {p0}, η2p = {pes}⟧, whereas for diverse-desire items the effect of age was smaller, ⟦F 2,87 3.62|F(2, 87) = 3.62, {p0}, η2p = {pes}⟧. Post hoc Tukey tests (not reported in full here; see Appendix C, ⟪p. 214⟫) indicated that the 5-year-olds outperformed both younger groups.

4.2 Executive function and theory of mind

Inhibitory control, measured with the day–night task, was positively related to false-belief performance, ⟦r 88 .41 p=eq:.000|r(88) = .41, p = .000⟧, and this relationship remained after controlling for age in months, ⟦r 87 .26|r(87) = .26, {p0}⟧. Working memory was related to false-belief performance, ⟦r 88 .29|r(88) = .29, {p0}⟧, but not after controlling for age, ⟦r 87 .11|r(87) = .11, {p0}⟧. The correlation between inhibitory control and diverse-desire performance, ⟦r 88 .19 p=eq:0.021 bad|r(88) = .19, p = 0.021⟧, was weaker.

4.3 Language

Children with higher receptive vocabulary scores passed more false-belief items, ⟦t 88 3.94|t(88) = 3.94, {p0}⟧. Bilingual children ⟪(n = 21)⟫ did not differ from monolingual children ⟪(n = 69)⟫ on false belief, ⟦t 88 1.12|t(88) = 1.12, {p0}⟧, but had higher inhibitory control scores, ⟦t 88 2.26 p=eq:0.013 bad|t(88) = 2.26, p = 0.013⟧. The proportion of children passing the explicit false-belief task increased with age, ⟦chi2 2 18.90 N=90 p=eq:.000|χ2(2, N = 90) = 18.90, p = .000⟧, and did not differ by sex, ⟦chi2 1 0.45 N=90|χ2(1, N = 90) = 0.45, {p0}⟧.

4.4 Summary

Overall, the age group effect in the mixed ANOVA was large (partial eta squared = .31, see above); Study 3 (Chapter 5) examines whether training inhibitory control changes false-belief performance. The coding scheme followed the manual by Eriksen-Mbeki (⟪2nd ed., pp. 55-61⟫) and all analyses were run in ⟪SPSS 27⟫. Note that ⟪Study 2 (t2)⟫ refers to the second testing wave.
