#description public-health survey report dominated by chi-square tests: χ2 and χ² with N, chi2 in plain ASCII, Cramér's V and phi, several results per sentence
RESULTS

Sample. Of 1,312 households approached, 604 returned usable questionnaires ⟪(N = 604)⟫; respondents were older than non-respondents (⟪M = 47.2, SD = 14.9⟫ vs. M = 43.8, SD = 15.6 years).

Vaccination uptake. Uptake differed by age band, ⟦chi2 3 27.44 N=604 eff=cramers-v:.21|χ2(3, N = 604) = 27.44, {p}, Cramér's V = .21⟧, by household size, ⟦chi2 2 9.87 N=604|χ2(2, N = 604) = 9.87, {p}, V = {V}⟧, and by whether the respondent had a regular general practitioner, ⟦chi2 1 15.30 N=604|χ2(1, N = 604) = 15.30, {p}, φ = {phi}⟧. It did not differ by sex, ⟦chi2 1 1.18 N=604|χ2(1, N = 604) = 1.18, {p}⟧, or by rural versus urban residence, ⟦chi2 1 2.71 N=604|χ2(1, N = 604) = 2.71, {p}⟧.

Information sources. Respondents who named television as their main source were less likely to be vaccinated (⟦chi2 1 6.45 N=598|χ²(1, N = 598) = 6.45, {p}⟧); those naming a health professional were more likely (⟦chi2 1 19.02 N=598|χ²(1, N = 598) = 19.02, {p}, φ = {phi}⟧); and social-media users did not differ (⟦chi2 1 0.37|χ²(1) = 0.37, {p}⟧).

Trust. Trust in health authorities was associated with education, ⟦chi2 4 13.25|chi2(4) = 13.25, {p}⟧, and with income tertile, ⟦chi2 2 4.2|chi2(2) = 4.2, {p}⟧. In the logistic model, trust remained a predictor (⟦z - 4.61|z = 4.61, {p}⟧), as did age (⟦z - 3.05|z = 3.05, {p}⟧), whereas sex did not (⟦z - -1.14|z = −1.14, {p}⟧).

Reasons for non-vaccination. The distribution of stated reasons differed between the 2022 and 2023 waves, ⟦chi2 5 12.83 p=eq:.005 bad|χ2(5, N = 211) = 12.83, p = .005⟧, and between respondents with and without chronic illness, ⟦chi2 5 8.02 N=211|χ2(5, N = 211) = 8.02, {p}⟧. Concern about side effects was the most common reason in both waves (41% and 44%), ⟦chi2 1 0.21 N=211|χ2(1, N = 211) = 0.21, {p}⟧.

Methods notes. Weights were computed in ⟪SPSS version 28.0.1⟫ following the household-size formula of Ruiz-Albers (⟪Journal of Made-up Studies, 7(2), 101-118⟫). Questionnaire items appear on ⟪p. 4⟫ of the supplement; the age bands are shown in ⟪Figure 2(c)⟫.
