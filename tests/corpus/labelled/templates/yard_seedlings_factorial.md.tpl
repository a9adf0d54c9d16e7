#description horticulture thesis chapter: a 2 × 3 between-subjects design with its cell n, M and SD in a long-format table, the F tests of its effects and Fisher's LSD comparisons of one factor's marginal means
## Seedling height under two light levels and three watering schedules

Tomato seedlings (N = 105) were raised under dim or bright light and watered daily, on alternate days or weekly, in a 2 × 3 between-subjects design; some trays lost seedlings to damping-off, so the cells are unequal.

Table 1
Seedling height (cm) after four weeks by light and watering

| Light | Watering | n | M | SD |
| --- | --- | --- | --- | --- |
| Dim | Daily | 8 | 20.61 | 2.59 |
| | Alternate | 15 | 23.68 | 2.91 |
| | Weekly | 22 | 18.82 | 2.17 |
| Bright | Daily | 30 | 18.95 | 2.66 |
| | Alternate | 11 | 20.08 | 2.90 |
| | Weekly | 19 | 19.74 | 2.56 |

Height (Table 1) was analysed in a two-way ANOVA with type III sums of squares. There was a main effect of light, ⟦F 1,99 6.72|F(1, 99) = 6.72, {p}, ηp2 = {pes3}⟧, and a main effect of watering, ⟦F 2,99 8.16|F(2, 99) = 8.16, {p}, ηp2 = {pes3}⟧.
The light × watering interaction was also significant, ⟦F 2,99 6.15|F(2, 99) = 6.15, {p}, ηp2 = {pes3}⟧.

Fisher's LSD comparisons of the watering schedules (observed marginal means) followed.
Alternate-day watering (M = 22.16) gave taller seedlings than daily watering (M = 19.30), ⟦t 99 4.31|t(99) = 4.31, {p}⟧.
Alternate-day watering (M = 22.16) also gave taller seedlings than weekly watering (M = 19.25), ⟦t 99 4.46|t(99) = 4.46, {p}⟧.
Daily (M = 19.30) and weekly watering (M = 19.25) did not differ, ⟦t 99 0.09|t(99) = 0.09, {p}⟧.
