import { synthesizeContour, type RadialDescriptor } from './lib/shape/index';
function mulberry32(seed: number) { let s = seed >>> 0; return () => { s = (s + 0x6d2b79f5) >>> 0; let t = s; t = Math.imul(t ^ (t >>> 15), t | 1); t ^= t + Math.imul(t ^ (t >>> 7), t | 61); return ((t ^ (t >>> 14)) >>> 0) / 4294967296; }; }
const random = mulberry32(4246);
const pool: RadialDescriptor[] = Array.from({ length: 256 }, () => { const ks = new Set<number>(); while (ks.size < 4) ks.add(2 + Math.floor(random() * 8)); return { family: 'radial', baseRadius: 1, terms: [...ks].map((k) => ({ k, amplitude: 0.11 * random(), phase: 6.28 * random() })) }; });
function run(n: number) { let s = 0; const t = performance.now(); for (let i = 0; i < n; i++) s += synthesizeContour(pool[i & 255]!, 1024).x[i & 1023]!; return [n / ((performance.now() - t) / 1000), s] as const; }
run(20000); console.log(Math.round(run(60000)[0]));
