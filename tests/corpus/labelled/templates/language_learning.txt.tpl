#description second-language learning study: several results per sentence, results after semicolons, shared "ps" p values, F < 1 with df, thin and non-breaking spaces
Results

Vocabulary post-test. Learners in the retrieval-practice group recalled more translations than those in the restudy group at both the immediate and delayed tests, ⟦F 1,86 18.42 p=lt:.001 pshared|F(1, 86) = 18.42⟧ and ⟦F 1,86 25.93 p=lt:.001|F(1, 86) = 25.93, ps < .001⟧, respectively; forgetting over the week was substantial, ⟦F 1,86 63.10|F(1, 86) = 63.10, {p}, ηp2 = {pes}⟧; and the group × test interaction was not reliable, ⟦F 1,86 <1|F(1, 86) < 1⟧.

Item analyses gave the same picture: ⟦F 1,78 12.30|F(1, 78) = 12.30, {p}⟧ for group; ⟦F 1,78 40.21|F(1, 78) = 40.21, {p}⟧ for test; and ⟦F 1,78 1.48|F(1, 78) = 1.48, {p}⟧ for the interaction.

Transfer. Retrieval practice also improved production of the words in new sentences (⟦t 86 2.76|t(86)\u00a0=\u00a02.76, p\u00a0=\u00a0{pval}, d\u00a0=\u00a0{d}⟧) and in a picture-naming task (⟦t 86 2.31|t(86)\u2009=\u20092.31, p\u2009=\u2009{pval}, d\u2009=\u2009{d}⟧); it did not improve pronunciation ratings (⟦t 86 0.85|t(86) = 0.85, {p}⟧).

Learner differences. Working-memory span predicted delayed recall, ⟦r 86 .34|r(86) = .34, {p}⟧; prior language experience did not, ⟦r 86 .07|r(86) = .07, {p}⟧. Neither the age of the learners, ⟦r 86 -.05 p=eq:.64|r(86) = −.05, p = .64⟧, nor the number of languages spoken, ⟦r 86 .12 p=eq:.03 bad|r(86) = .12, p = .03⟧, related to the retrieval benefit.

Strategy use. More retrieval-practice learners reported self-testing at home (62% vs. 35%), ⟦chi2 1 6.41 N=88|χ2(1, N\u00a0=\u00a088) = 6.41, {p}⟧; reports of flashcard use did not differ, ⟦chi2 1 0.03 N=88|χ2(1, N = 88) = 0.03, {p}⟧; and the proportion who found the task enjoyable was similar, ⟦chi2 1 1.87 N=88 p=eq:.017 bad|χ2(1, N = 88) = 1.87, p = .017⟧.

Delayed test by session. Recall on the delayed test was stable across the four testing sessions; ⟦F 3,84 0.96|F(3, 84) = 0.96, {p}⟧. Confidence ratings rose across sessions; ⟦F 3,84 4.87|F(3, 84) = 4.87, {p}, ηp2 = {pes}⟧.

The word lists (Appendix A, ⟪pp. 22-24⟫) were matched on frequency using the norms in Vasquez-Holm (⟪Journal of Made-up Studies, 31(4), 210-229⟫). Learners were tested in groups ⟪(n = 8 to 12)⟫.
