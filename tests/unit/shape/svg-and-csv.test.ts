import { describe, expect, it } from 'vitest';
import { contourArea, contourToSvgPath, parseCsvOutline, parseSvgOutline, synthesizeContour } from '@/lib/shape';
import { maxAbsDifference, polygon } from './support';

const square = polygon([[0, 0], [1, 0], [1, 1], [0, 1]]);

describe('contourToSvgPath', () => {
  it('writes a polygon with fixed decimals, y flipped for SVG, and no negative zero', () => {
    expect(contourToSvgPath(square)).toBe('M0.000 0.000L1.000 0.000L1.000 -1.000L0.000 -1.000Z');
    expect(contourToSvgPath(square, { decimals: 1, flipY: false })).toBe('M0.0 0.0L1.0 0.0L1.0 1.0L0.0 1.0Z');
    expect(contourToSvgPath(polygon([[-0.0001, 0], [1, 0], [0, 1]]))).toMatch(/^M0\.000 0\.000L/);
  });

  it('is deterministic', () => {
    const contour = synthesizeContour({ family: 'radial', baseRadius: 50, terms: [{ k: 3, amplitude: 0.1, phase: 0.3 }] }, 256);
    const smooth = contourToSvgPath(contour, { curve: 'smooth', decimals: 4 });
    expect(contourToSvgPath(contour, { curve: 'smooth', decimals: 4 })).toBe(smooth);
    expect(smooth.match(/C/g)).toHaveLength(256);
  });

  it('smooth output is the Catmull–Rom spline: it passes through every vertex', () => {
    // Catmull & Rom 1974: the uniform spline interpolates its control points; each Bézier ends on a vertex.
    const contour = synthesizeContour({ family: 'radial', baseRadius: 1, terms: [] }, 12);
    const path = contourToSvgPath(contour, { curve: 'smooth', decimals: 6, flipY: false });
    const ends = [...path.matchAll(/C(?:[-\d.]+ ){4}([-\d.]+) ([-\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])]);
    ends.forEach(([x, y], i) => {
      expect(x).toBeCloseTo(contour.x[(i + 1) % 12] as number, 6);
      expect(y).toBeCloseTo(contour.y[(i + 1) % 12] as number, 6);
    });
  });
});

describe('parseSvgOutline (paper.js CompoundPath, flattened)', () => {
  it('round-trips a polygon through path data within the printed precision', () => {
    const contour = synthesizeContour({ family: 'radial', baseRadius: 10, terms: [{ k: 5, amplitude: 0.1, phase: 0 }] }, 128);
    const back = parseSvgOutline(contourToSvgPath(contour, { decimals: 6 }));
    expect(back.x.length).toBe(128);
    expect(maxAbsDifference(back.x, contour.x)).toBeLessThan(1e-6);
    expect(maxAbsDifference(back.y, contour.y)).toBeLessThan(1e-6);
  });

  it('reads a whole SVG document and flattens arcs and curves', () => {
    // Two half-circle arcs of radius 50 make a circle: area π·50² within the flattening tolerance.
    const svg = `<?xml version="1.0"?>\n<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 200 200">\n  <path fill="black" d="M150 100 A50 50 0 1 1 50 100 A50 50 0 1 1 150 100 Z"/>\n</svg>`;
    const contour = parseSvgOutline(svg);
    expect(Math.abs(Math.abs(contourArea(contour)) - Math.PI * 2500) / (Math.PI * 2500)).toBeLessThan(1e-3);
    const cubic = parseSvgOutline("<svg><path d='M0,0 C10,0 10,10 0,10 Z'/></svg>");
    expect(cubic.x.length).toBeGreaterThan(10);
  });

  it('accepts a polygon element and a closed path without Z whose ends meet', () => {
    expect(parseSvgOutline('<svg><polygon points="0,0 4,0 0,3"/></svg>').x.length).toBe(3);
    expect(Math.abs(contourArea(parseSvgOutline('M0 0 L4 0 L0 3 L0 0')))).toBeCloseTo(6, 12);
  });

  it('flips y by default so the outline keeps its on-screen orientation', () => {
    // Drawn clockwise in SVG's y-down frame is counter-clockwise in the y-up frame.
    expect(contourArea(parseSvgOutline('M0 0 L1 0 L1 1 L0 1 Z'))).toBe(-1);
    expect(contourArea(parseSvgOutline('M0 0 L1 0 L1 1 L0 1 Z', { flipY: false }))).toBe(1);
  });
});

describe('parseCsvOutline', () => {
  it('reads x,y rows with a header, comments, blank lines and mixed separators; drops the closing repeat', () => {
    const contour = parseCsvOutline('x,y\n# outline\n0,0\n\n4;0\n0\t3\n0 0\n');
    expect(Array.from(contour.x)).toEqual([0, 4, 0]);
    expect(Array.from(contour.y)).toEqual([0, 0, 3]);
    expect(contourArea(contour)).toBe(6);
  });

  it('reads scientific notation and CRLF line ends', () => {
    const contour = parseCsvOutline('1e-3,2.5E2\r\n-1,0\r\n.5,-.5\r\n');
    expect(contour.x[0]).toBe(0.001);
    expect(contour.y[0]).toBe(250);
    expect(contour.x[2]).toBe(0.5);
  });
});
