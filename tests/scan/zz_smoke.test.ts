import { test } from 'vitest';
import { scanText } from '/work/main/src/scan/scan.js';
const samples = [
  'The effect was significant, F(2, 57) = 4.21, p = .021, ηp2 = .13, 90% CI [.01, .25].',
  'r = −.32, p = .02; r = .32 alone',
  'We report the main effect (F(1,\u00a044) = 5.10, p\u2009<\u2009.05, η²p = .10 [.01, .22]) and signif-\nicant ones; t(28)\u00a0=\u00a0\u22122.21, P = 0·03, Cohen’s d = 0.41, 95% CI: 0.10 to 0.72. 𝐹(2, 40) = 3.3, 𝑝 = .045.',
  'An alpha level of .01 was used. Cronbach’s α = .85. One-tailed tests were used for directional hypotheses. A total of 86 adults took part; data from 3 participants were excluded. Sphericity was violated, so Greenhouse–Geisser corrections were applied. We tested 120 undergraduate psychology students (N = 120).',
  'p values below .005 were considered statistically significant. Mauchly’s test showed sphericity was not violated.',
];
test('smoke', () => {
  for (const s of samples) {
    const out = scanText(s);
    console.log('---', JSON.stringify(s));
    for (const r of out.results) console.log(r.kind, JSON.stringify(r.text), r.df.map(d=>d.text), r.valueComparator, r.value?.text, r.p ? `${r.p.comparator}${r.p.value.text}(${r.p.value.value})${r.p.plural?'s':''} ${JSON.stringify(s.slice(r.p.start,r.p.end))}` : null, r.notSignificant?'ns':'', r.effects.map(e=>`${e.kind}${e.comparator}${e.value.text}${e.interval?`[${e.interval.level} ${e.interval.low.text},${e.interval.high.text}]`:''} ${JSON.stringify(s.slice(e.start,e.end))}`).join(' '), r.sampleSize?.text ?? '');
    console.log(JSON.stringify(out.context, null, 1));
  }
});
