import { XMLParser, XMLValidator } from 'fast-xml-parser';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { niceTicks, pseByDirectionSvg, psychometricCurvesSvg, slopePolarSvg, type CurvePanel } from '@/lib/plot';
import { evaluatePsychometric } from '@/lib/stats';

const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '', isArray: (_name, _path, _leaf, isAttribute) => !isAttribute });
type Node = Record<string, unknown>;

/** Every element named `name` in the parsed document, depth first. */
function elements(node: unknown, name: string): Node[] {
  if (Array.isArray(node)) return node.flatMap((n) => elements(n, name));
  if (node === null || typeof node !== 'object') return [];
  return Object.entries(node as Node).flatMap(([key, value]) => [...(key === name ? (value as Node[]) : []), ...elements(value, name)]);
}

async function expectRenderable(svg: string) {
  expect(XMLValidator.validate(svg)).toBe(true);
  const meta = await sharp(Buffer.from(svg)).png().toBuffer({ resolveWithObject: true });
  expect(meta.info.width).toBeGreaterThan(0);
}

const PANELS: CurvePanel[] = [
  { directionDeg: 0, points: [{ x: -0.8, n: 10, k: 0 }, { x: 0, n: 40, k: 20 }, { x: 0.8, n: 10, k: 10 }], curve: { link: 'logit', threshold: 0.1, spread: 0.15, lapse: 0.02 } },
  { directionDeg: 22.5, points: [{ x: -0.8, n: 10, k: 1 }, { x: 0.8, n: 10, k: 9 }], curve: { link: 'probit', threshold: -0.05, spread: 0.2, lapse: 0 } },
  { directionDeg: 45, points: [{ x: 0, n: 5, k: 2 }], curve: null },
];

describe('psychometricCurvesSvg', () => {
  it('is a valid, renderable SVG with one panel per direction, a curve per fit and points sized by n', async () => {
    const svg = psychometricCurvesSvg(PANELS, [-0.8, 0.8], { title: 'Curves <of> "A & B"', description: 'P(B) by position', xLabel: 'position towards B' });
    await expectRenderable(svg);
    const doc = parser.parse(svg);
    expect(elements(doc, 'title')[0]!['#text']).toBe('Curves <of> "A & B"');
    expect(elements(doc, 'g').map((g) => g['data-direction'])).toEqual(['0', '22.5', '45']);
    const curves = elements(doc, 'path').filter((p) => p.class === 'curve');
    expect(curves.map((c) => c['data-curve'])).toEqual(['0', '22.5']);
    const points = elements(doc, 'circle').filter((c) => c.class === 'point');
    expect(points).toHaveLength(6);
    const radius = (n: number) => Number(points.find((p) => p['data-n'] === String(n))!.r);
    expect(radius(40)).toBeGreaterThan(radius(10));
    expect(radius(10)).toBeGreaterThan(radius(5));
  });

  it('draws the fitted ψ: the curve passes through 0.5 at the PSE', () => {
    const svg = psychometricCurvesSvg([PANELS[0]!], [-0.8, 0.8], { title: 't', description: 'd', xLabel: 'x' });
    const d = String(elements(parser.parse(svg), 'path')[0]!.d);
    const coords = d.split(/[ML]/).filter(Boolean).map((s) => s.trim().split(' ').map(Number) as [number, number]);
    // Panel geometry: x from 38 to 190 over [−0.8, 0.8], y from 22 (p = 1) to 130 (p = 0).
    const toData = ([sx, sy]: [number, number]) => [-0.8 + ((sx - 38) / 152) * 1.6, 1 - (sy - 22) / 108] as const;
    for (const c of coords.filter((_, i) => i % 16 === 0)) {
      const [x, p] = toData(c);
      expect(p).toBeCloseTo(evaluatePsychometric('logit', { threshold: 0.1, spread: 0.15, lapse: 0.02 }, x), 1);
    }
  });
});

describe('slopePolarSvg and pseByDirectionSvg', () => {
  const estimates = [
    { directionDeg: 0, value: 2, interval: [1.5, 2.6] as const },
    { directionDeg: 60, value: 3, interval: [2.2, 3.9] as const },
    { directionDeg: 120, value: 2.5, interval: null },
  ];

  it('draws each diameter at both ends, with an interval bar where there is one', async () => {
    const svg = slopePolarSvg(estimates, { title: 'Slope by direction', description: 'd' });
    await expectRenderable(svg);
    const doc = parser.parse(svg);
    const points = elements(doc, 'circle').filter((c) => c.class === 'estimate');
    expect(points.map((p) => p['data-direction'])).toEqual(['0', '0', '60', '60', '120', '120']);
    expect(elements(doc, 'line').filter((l) => l.class === 'interval')).toHaveLength(4);
    // Opposite ends of a diameter sit symmetrically about the centre (160, 160).
    const [a, b] = points.filter((p) => p['data-direction'] === '60');
    expect(Number(a!.cx) + Number(b!.cx)).toBeCloseTo(320, 1);
    expect(Number(a!.cy) + Number(b!.cy)).toBeCloseTo(320, 1);
  });

  it('puts the PSEs against direction with the zero line', async () => {
    const svg = pseByDirectionSvg([{ directionDeg: 0, value: 0.1, interval: [0.02, 0.2] }, { directionDeg: 90, value: -0.05, interval: [-0.1, 0.01] }], { title: 'PSE', description: 'd', yLabel: 'PSE' });
    await expectRenderable(svg);
    const doc = parser.parse(svg);
    const points = elements(doc, 'circle').filter((c) => c.class === 'estimate');
    expect(points).toHaveLength(2);
    const zero = elements(doc, 'line').find((l) => l.class === 'zero')!;
    expect(Number(points[0]!.cy)).toBeLessThan(Number(zero.y1));
    expect(Number(points[1]!.cy)).toBeGreaterThan(Number(zero.y1));
    expect(Number(points[1]!.cx)).toBeGreaterThan(Number(points[0]!.cx));
  });
});

describe('niceTicks', () => {
  it('steps by 1, 2 or 5 × 10ⁿ across the range', () => {
    expect(niceTicks(-0.8, 0.8, 4)).toEqual([-0.5, 0, 0.5]);
    expect(niceTicks(-0.8, 0.8, 8)).toEqual([-0.8, -0.6, -0.4, -0.2, 0, 0.2, 0.4, 0.6, 0.8]);
    expect(niceTicks(0, 7, 4)).toEqual([0, 2, 4, 6]);
    expect(niceTicks(0, 7, 3)).toEqual([0, 5]);
  });
});

describe('slopePolarSvg scale', () => {
  it('follows the estimates and clips an interval that runs far beyond them', () => {
    const svg = slopePolarSvg(
      [
        { directionDeg: 0, value: 2, interval: [1, 40] },
        { directionDeg: 90, value: 2.5, interval: [2, 3] },
      ],
      { title: 't', description: 'd' },
    );
    const doc = parser.parse(svg);
    const radius = (c: Node) => Math.hypot(Number(c.cx) - 160, Number(c.cy) - 160);
    const steepest = elements(doc, 'circle').filter((c) => c.class === 'estimate' && c['data-direction'] === '90');
    // Outer edge at 2 × 2.5 = 5 (a nice tick) → radius 120; the estimate 2.5 at half of it.
    expect(radius(steepest[0]!)).toBeCloseTo(60, 0);
    const bars = elements(doc, 'line').filter((l) => l.class === 'interval');
    for (const b of bars) expect(Math.max(Math.hypot(Number(b.x1) - 160, Number(b.y1) - 160), Math.hypot(Number(b.x2) - 160, Number(b.y2) - 160))).toBeLessThanOrEqual(120.01);
  });
});
