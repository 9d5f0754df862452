(globalThis as any).EV = { setup: 0, main: 0, other: 0, steep: 0 }; (globalThis as any).CL = { setup: 0, main: 0, other: 0, steep: 0 }; (globalThis as any).PHASE = 'setup';
import { createPsychometricFitter } from '@/lib/stats/create-psychometric-fitter';
import { drawBinomial, evaluatePsychometric, seededRandom, fitPsychometric } from '@/lib/stats';
import { spreadBoundsFor } from '@/lib/stats/spread-bounds-for';
const LEVELS = [-5, -4, -3, -2, -1, 0, 1, 2, 3, 4, 5];
const OPTIONS = { link: 'logit' as const, lapse: { max: 0.06 } };
const random = seededRandom(2026);
const chunks: number[] = []; let chunkStart = 0; let loopMs = 0; const DUMP: number[] = []; let CHK = 0; let totalIter = 0, fits = 0, modeCount = 0, sets = 0;
const t0 = performance.now();
for (let p = 0; p < 40; p++) for (let d = 0; d < 16; d++) {
  const truth = { threshold: 0.3 * Math.sin(d), spread: 1.2, lapse: 0.02 };
  const data = { x: LEVELS, n: LEVELS.map(() => 10), k: LEVELS.map((x) => drawBinomial(10, evaluatePsychometric('logit', truth, x), random)) };
  const fit = fitPsychometric(data, OPTIONS);
  const bounds = spreadBoundsFor(data, OPTIONS);
  const fitter = createPsychometricFitter(data.x, data.n, { link: 'logit', spreadBounds: bounds, lapse: OPTIONS.lapse, newtonTolerance: 1e-4 });
  const modes = createPsychometricFitter(data.x, data.n, { link: 'logit', spreadBounds: bounds, lapse: OPTIONS.lapse }).findModes(data.k, 10);
  modeCount += modes.length; sets++;
  const psi = data.x.map((x) => evaluatePsychometric('logit', fit, x));
  const r2 = seededRandom(p * 16 + d);
  const k = new Float64Array(11); const tl = process.cpuUsage().user / 1000;
  for (let r = 0; r < 200; r++) {
    if (r % 50 === 0) { const now = performance.now(); if (r > 0) chunks.push((now - chunkStart) / 50); chunkStart = now; }
    for (let i = 0; i < 11; i++) k[i] = drawBinomial(10, psi[i]!, r2);
    (globalThis as any).PHASE = 'main'; const res = fitter.fit(k, process.env.ONE ? modes[0] : modes); (globalThis as any).PHASE = 'setup';
    totalIter += res.iterations; fits++; DUMP.push(res.logLikelihood); CHK += res.threshold + res.spread + res.lapse + res.logLikelihood;
  }
  chunks.push((performance.now() - chunkStart) / 50);
  loopMs += process.cpuUsage().user / 1000 - tl;
}
const ms = performance.now() - t0;
(await import('node:fs')).writeFileSync(process.env.OUT ?? '/tmp/dump.json', JSON.stringify(DUMP)); console.log((globalThis as any).EV, (globalThis as any).CL); console.log({ CHK, fits, p10: (chunks.sort((a, b) => a - b)[Math.floor(chunks.length / 10)]! * 1000).toFixed(2), loopUs: (loopMs*1000/fits).toFixed(1), usPerFit: (ms * 1000 / fits).toFixed(1), itersPerFit: (totalIter / fits).toFixed(2), modesPerSet: (modeCount / sets).toFixed(2) });
