#description consumer-marketing lab experiment: square-bracket df, leading-zero p values, omega squared and Cohen's f, results after semicolons
Study 1: Scarcity cues and willingness to pay

Results. A one-way ANOVA on willingness to pay across the three message conditions (limited stock, limited time, control) was significant, ⟦F 2,147 5.64|F[2, 147] = 5.64, {p0}, ω2 = {w2}⟧. Purchase intention showed the same ordering, ⟦F 2,147 3.91|F[2, 147] = 3.91, {p0}, ω2 = {w2}⟧; perceived product quality did not differ, ⟦F 2,147 0.47|F[2, 147] = 0.47, {p0}⟧; and perceived manipulative intent was highest for limited time, ⟦F 2,147 7.12|F[2, 147] = 7.12, {p0}, η2 = {es}⟧.

Planned contrasts showed that limited stock raised willingness to pay relative to control, ⟦t 147 3.29|t[147] = 3.29, {p0}⟧; limited time did not, ⟦t 147 1.37|t[147] = 1.37, {p0}⟧; and the two scarcity messages differed from each other, ⟦t 147 2.03|t[147] = 2.03, {p0}⟧.

Study 2: Brand familiarity as a moderator

Results. In the 2 × 2 between-subjects design (scarcity: present vs. absent; brand: familiar vs. unfamiliar), the scarcity effect replicated, ⟦F 1,196 8.77|F(1, 196) = 8.77, {p0}, Cohen's f = {f}⟧; the brand main effect was large, ⟦F 1,196 24.50|F(1, 196) = 24.50, {p0}, f = {f}⟧; and the interaction was significant, ⟦F 1,196 4.02|F(1, 196) = 4.02, {p0}, f = {f}⟧, with scarcity mattering only for unfamiliar brands (⟦t 98 3.45|t(98) = 3.45, {p0}⟧ vs. ⟦t 98 0.22|t(98) = 0.22, {p0}⟧).

Click-through in the field follow-up was higher for the scarcity banner (2.9% vs. 2.1%), ⟦z - 2.45|z = 2.45, {p0}⟧. Time on page did not differ, ⟦z - 1.71 p=eq:0.044 bad|z = 1.71, p = 0.044⟧, although this was the one-tailed value.

Manipulation checks were analysed by condition; the scarcity manipulation was perceived as intended, ⟦F 1,196 61.30 p=eq:0.000|F(1, 196) = 61.30, p = 0.000⟧.

Notes. Participants were recruited through an online panel ⟪(N = 150)⟫ in Study 1 and ⟪(N = 200)⟫ in Study 2. The product images appear in ⟪Figure 5F⟫. Purchase-funnel conversion was predicted with a gradient-boosted classifier (⟪F1 score of .83⟫ on held-out sessions). Survey logic was built in ⟪version 3.12⟫ of the panel software.
