#description cognitive study that also trains a machine-learning classifier: F1 scores and other classifier metrics as look-alikes beside real F and t tests
4. Results

4.1 Behavioural memory effects

Recognition accuracy was higher for emotional than for neutral pictures, ⟦F 1,35 16.84|F(1, 35) = 16.84, {p}, ηp2 = {pes}⟧, and higher after a 10-min than after a 24-h delay, ⟦F 1,35 44.27|F(1, 35) = 44.27, {p}, ηp2 = {pes}⟧. The emotion advantage grew with delay, ⟦F 1,35 5.93|F(1, 35) = 5.93, {p}, ηp2 = {pes}⟧. Remember responses showed the same interaction, ⟦F 1,35 7.71|F(1, 35) = 7.71, {p}, ηp2 = {pes}⟧, whereas know responses did not, ⟦F 1,35 0.38|F(1, 35) = 0.38, {p}, ηp2 = {pes}⟧.

4.2 Decoding memory strength from pupil data

We trained a linear classifier to separate later-remembered from later-forgotten trials. Across participants it reached ⟪F1 = 0.91⟫ on the emotional trials and an ⟪F1 score of .74⟫ on neutral trials (chance level about .50), with ⟪precision = .88⟫ and ⟪recall = .79⟫ overall. Classifier accuracy exceeded the permutation baseline, ⟦t 35 6.47|t(35) = 6.47, {p}, dz = {dz}⟧, and was higher for emotional than for neutral trials, ⟦t 35 3.11|t(35) = 3.11, {p}, dz = {dz}⟧. Decoding accuracy correlated with the behavioural emotion effect, ⟦r 34 .38|r(34) = .38, {p}⟧. Feature importance for the first 500 ms was low (⟪F1 drop = 0.02⟫ when removed), and the model was trained with scikit-learn ⟪version 1.3.2⟫.

4.3 Pupil dilation

Peak dilation was larger for emotional pictures, ⟦t 35 4.02|t(35) = 4.02, {p}⟧, and larger for later-remembered pictures, ⟦t 35 2.37|t(35) = 2.37, {p}⟧; the difference between remembered and forgotten trials did not interact with emotion, ⟦F 1,35 1.26|F(1, 35) = 1.26, {p}⟧. Baseline pupil size did not differ between conditions, ⟦t 35 0.71 p=eq:.048 bad|t(35) = 0.71, p = .048⟧. Dilation slopes (⟪Figure 3F⟫) were compared with a permutation-based cluster test, ⟦z - 2.97|z = 2.97, {p}⟧.

4.4 Sleep and memory

Sleep duration the night after encoding predicted the emotion effect at 24 h, ⟦r 34 .35 calc=.25 bad|r(34) = .35, {p}⟧, but not at 10 min, ⟦r 34 .04|r(34) = .04, {p}⟧. Participants who napped ⟪(n = 9)⟫ were excluded from this analysis in a robustness check, which gave ⟦r 25 .41|r(25) = .41, {p}⟧.
