import type { DescriptorInput } from './schemas/descriptor';

/** Starting points for the seed-shape editor: invented shapes, each valid (r > 0, simple). */
export const SEED_PRESETS: readonly { id: string; label: string; descriptor: DescriptorInput }[] = [
  {
    id: 'trefoil',
    label: 'Soft trefoil',
    descriptor: { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.15, phase: 0 }] },
  },
  {
    id: 'pebble',
    label: 'Lopsided pebble',
    descriptor: {
      family: 'radial',
      baseRadius: 1,
      terms: [
        { k: 2, amplitude: 0.12, phase: 0.4 },
        { k: 3, amplitude: 0.08, phase: 1.9 },
        { k: 5, amplitude: 0.04, phase: -0.6 },
      ],
    },
  },
  {
    id: 'starfish',
    label: 'Blunt five-point star',
    descriptor: { family: 'radial', baseRadius: 1, terms: [{ k: 5, amplitude: 0.09, phase: 0 }, { k: 10, amplitude: 0.02, phase: 0 }] },
  },
  {
    id: 'bean',
    label: 'Bean (elliptic)',
    descriptor: {
      family: 'elliptic',
      center: [0, 0],
      terms: [
        { n: 1, a: 1.2, b: 0, c: 0, d: 0.8 },
        { n: 2, a: 0, b: 0.05, c: 0.22, d: 0 },
        { n: 3, a: 0.04, b: 0, c: 0, d: 0.03 },
      ],
    },
  },
  {
    id: 'comma',
    label: 'Comma (complex)',
    descriptor: {
      family: 'complex',
      terms: [
        { k: 1, re: 1, im: 0 },
        { k: -1, re: 0.18, im: 0.05 },
        { k: 2, re: 0.1, im: -0.06 },
        { k: -2, re: 0.05, im: 0 },
      ],
    },
  },
];
