import { describe, expect, it } from 'vitest';
import { heatmapColour, HEATMAP_STEPS, mdsMapSvg, rdmHeatmapsSvg } from '@/lib/render';

describe('rdmHeatmapsSvg', () => {
  it('draws every panel on one scale (each matrix over its own largest value), greys cells without data, and has a legend', () => {
    const a = [[0, 1], [1, 0]];
    const b = [[0, 10], [10, 0]];
    const c = [[0, null], [null, 0]];
    const svg = rdmHeatmapsSvg([{ title: 'Perceptual <ratings>', values: c }, { title: 'Design', values: a }, { title: 'Contour', values: b }], 'Heatmaps');
    // The largest cells of matrices in different units get the same, darkest colour.
    const darkest = heatmapColour(HEATMAP_STEPS - 1);
    expect(svg.split(`fill="${darkest}"`).length - 1).toBeGreaterThanOrEqual(4 + 1);
    expect(svg).toContain('fill="#B8B3A8"');
    expect(svg).toContain('no rating');
    expect(svg).toContain('data-part="legend"');
    expect(svg).toContain('Perceptual &lt;ratings&gt;');
    expect(svg.match(/<g transform/g)).toHaveLength(3);
    expect(heatmapColour(0)).toBe('#faf7f0');
    expect(heatmapColour(HEATMAP_STEPS - 1)).toBe('#0e5d63');
  });

  it('merges runs of equal cells, so a constant row is one rectangle', () => {
    const zeros = Array.from({ length: 50 }, () => Array.from({ length: 50 }, () => 0));
    const svg = rdmHeatmapsSvg([{ title: 'Flat', values: zeros }], 'Flat');
    const cells = svg.split('<g transform')[1]!.split('</g>')[0]!.match(/<rect /g)!.length;
    expect(cells).toBe(50 + 1);
  });
});

describe('mdsMapSvg', () => {
  it('joins each design position to its recovered one, with equal aspect and +b up', () => {
    const svg = mdsMapSvg([{ id: 'r1s0', design: [1, 0], recovered: [0.5, 0] }, { id: 'r1s1', design: [0, 1], recovered: [0, 0.5] }], 'Map');
    expect(svg.match(/<line /g)).toHaveLength(2 + 2);
    expect(svg).toContain('<title>r1s0: designed</title>');
    // Extent 1 maps to 180 − 28 = 152 units from the centre (180, 180): (1, 0) → x 332; (0, 1) → y 28.
    expect(svg).toContain('cx="332" cy="180"');
    expect(svg).toContain('cx="180" cy="28"');
    expect(svg).toContain('cx="256" cy="180"');
  });
});
