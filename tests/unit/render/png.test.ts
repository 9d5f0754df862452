import { PNG } from 'pngjs';
import { describe, expect, it } from 'vitest';
import { frameStimuli, resolveRender, stimulusSvg, stimulusSvgPair, type DisplayProfile, type RenderOptions } from '@/lib/render';
import sharp from 'sharp';
import { PNG_COMPRESSION_LEVEL, renderPng } from '@/lib/render/render-png';
import { synthesizeContour, type RadialDescriptor } from '@/lib/shape';

// 40 px/cm at 57.294325 cm: 1 cm subtends exactly 1° there (REFERENCES.md), so sizes are easy to read.
const PROFILE: DisplayProfile = { name: 'Test display', resolutionPx: { width: 1600, height: 900 }, widthCm: null, pixelsPerCm: 40, viewingDistanceCm: 57.294325 };

const options = (over: Partial<RenderOptions> = {}): RenderOptions => ({
  sizeDeg: 5,
  sizeMeasure: 'equal-area-diameter',
  canvasDeg: 7,
  style: 'silhouette',
  strokeArcmin: null,
  fill: 0,
  background: 255,
  antiAlias: true,
  transparent: false,
  samples: 1024,
  ...over,
});

/** The test's own S = 2D·tan(θ/2) in px, independent of lib/render. */
const px = (deg: number): number => 2 * PROFILE.viewingDistanceCm * Math.tan((deg * Math.PI) / 360) * 40;

async function draw(descriptor: RadialDescriptor, over: Partial<RenderOptions> = {}) {
  const render = resolveRender(PROFILE, options(over));
  const contour = synthesizeContour(descriptor, render.options.samples);
  const frame = frameStimuli([contour], render);
  const bytes = await renderPng({ svg: stimulusSvg(contour, frame, render, { units: 'pixels' }), sizePx: frame.canvasPx, channels: render.pngChannels });
  return { png: PNG.sync.read(Buffer.from(bytes)), render, frame, bytes };
}

/** Covered pixels: each pixel's grey level read as coverage between background (255) and fill (0). */
function coveredPixels(png: PNG): number {
  let sum = 0;
  for (let i = 0; i < png.width * png.height; i++) sum += (255 - (png.data[4 * i] as number)) / 255;
  return sum;
}

describe('PNG rendering (decoded with pngjs)', () => {
  const rf4: RadialDescriptor = { family: 'radial', baseRadius: 1, terms: [{ k: 4, amplitude: 0.1, phase: 0 }] };
  const rf3: RadialDescriptor = { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.1, phase: 0 }] };

  it('is as many pixels square as the display profile gives for the canvas', async () => {
    const { png, render } = await draw(rf3);
    expect(png.width).toBe(Math.round(px(7)));
    expect(png.height).toBe(Math.round(px(7)));
    expect(render.sizes.canvasPx).toBe(png.width);
  });

  it('fills the analytic area of a radial-frequency pattern sized by its maximum extent, within 1 %', async () => {
    // Wilkinson, Wilson & Habak (1998) RF pattern; area π r0²(1 + ½A²) (REFERENCES.md, derived) = 3.15730062 for A 0.1.
    // For even ω the maximum extent is 2 r0 (1 + A): |p − q| ≤ |p| + |q| ≤ 2 r_max, reached by the opposite peaks.
    const { png } = await draw(rf4, { sizeMeasure: 'max-extent' });
    const scale = px(5) / (2 * 1.1);
    const expected = 3.15730062 * scale * scale;
    expect(Math.abs(coveredPixels(png) - expected) / expected).toBeLessThan(0.01);
  });

  it('fills π(D/2)² for a shape sized by its equal-area diameter D, anti-aliased or not, within 1 %', async () => {
    const expected = Math.PI * (px(5) / 2) ** 2;
    for (const antiAlias of [true, false]) {
      const { png } = await draw(rf3, { antiAlias });
      expect(Math.abs(coveredPixels(png) - expected) / expected).toBeLessThan(0.01);
      const levels = new Set<number>();
      for (let i = 0; i < png.width * png.height; i++) levels.add(png.data[4 * i] as number);
      if (antiAlias) expect(levels.size).toBeGreaterThan(2);
      else expect([...levels].sort((a, b) => a - b)).toEqual([0, 255]);
    }
  });

  it('keeps nominal grey levels exactly and writes a grey PNG without alpha', async () => {
    const { png, bytes } = await draw(rf3, { fill: 40, background: 128 });
    // PNG IHDR (ISO/IEC 15948): colour type at byte 25; 0 is greyscale without alpha.
    expect(bytes[25]).toBe(0);
    expect(png.data[0]).toBe(128); // a corner is background
    const centre = (Math.floor(png.height / 2) * png.width + Math.floor(png.width / 2)) * 4;
    expect(png.data[centre]).toBe(40);
  });

  it('is transparent outside the shape when asked', async () => {
    const { png, bytes } = await draw(rf3, { transparent: true, fill: '#d55e00' });
    expect(bytes[25]).toBe(6); // RGBA
    expect(png.data[3]).toBe(0);
    const centre = (Math.floor(png.height / 2) * png.width + Math.floor(png.width / 2)) * 4;
    expect([...png.data.subarray(centre, centre + 4)]).toEqual([0xd5, 0x5e, 0x00, 255]);
  });

  it('draws an outline whose stroke is the asked arc-minutes wide', async () => {
    // A circle's stroke ring has area π((R + w/2)² − (R − w/2)²) = 2πRw.
    const circle: RadialDescriptor = { family: 'radial', baseRadius: 1, terms: [] };
    const { png, render } = await draw(circle, { style: 'outline', strokeArcmin: 12 });
    const expected = 2 * Math.PI * (px(5) / 2) * render.sizes.strokePx;
    expect(render.sizes.strokePx).toBeCloseTo(px(12 / 60), 9);
    expect(Math.abs(coveredPixels(png) - expected) / expected).toBeLessThan(0.01);
  });

  it('a grey PNG is byte for byte what libvips\'s sRGB → b-w conversion of the drawing gives', async () => {
    // renderPng takes the red band for grey images; the plain route converts the colourspace.
    for (const over of [{ fill: 40, background: 200 }, { fill: 0, background: 128, antiAlias: false }, { fill: 255, background: 0, style: 'outline' as const, strokeArcmin: 6 }]) {
      const { bytes, render, frame } = await draw(rf3, over);
      const contour = synthesizeContour(rf3, render.options.samples);
      const svg = stimulusSvg(contour, frame, render, { units: 'pixels' });
      const plain = await sharp(Buffer.from(svg, 'utf8'))
        .removeAlpha()
        .toColourspace('b-w')
        .png({ compressionLevel: PNG_COMPRESSION_LEVEL, adaptiveFiltering: false, palette: false })
        .toBuffer();
      expect(Buffer.from(bytes).equals(plain)).toBe(true);
    }
  });

  it('renders the same bytes twice', async () => {
    const a = await draw(rf3);
    const b = await draw(rf3);
    expect(Buffer.from(a.bytes).equals(Buffer.from(b.bytes))).toBe(true);
  });
});

describe('SVG documents', () => {
  it('carry their physical size in mm, a pixel viewBox and the chosen paint', () => {
    const render = resolveRender(PROFILE, options({ antiAlias: false, transparent: true }));
    const contour = synthesizeContour({ family: 'radial', baseRadius: 1, terms: [] }, 64);
    const frame = frameStimuli([contour], render);
    const svg = stimulusSvg(contour, frame, render);
    const mm = ((frame.canvasPx / 40) * 10).toFixed(3);
    expect(svg).toContain(`width="${mm}mm" height="${mm}mm" viewBox="0 0 ${frame.canvasPx} ${frame.canvasPx}"`);
    expect(svg).toContain('shape-rendering="crispEdges"');
    expect(svg).not.toContain('<rect');
    expect(svg).toContain('fill="#000000"');
    expect(stimulusSvg(contour, frame, render, { units: 'pixels' })).toContain(`width="${frame.canvasPx}" height="${frame.canvasPx}"`);
  });

  it('stimulusSvgPair gives exactly the physical and the pixel documents of stimulusSvg', () => {
    for (const over of [{}, { antiAlias: false, transparent: true }, { style: 'outline' as const, strokeArcmin: 6 }]) {
      const render = resolveRender(PROFILE, options(over));
      const contour = synthesizeContour({ family: 'radial', baseRadius: 1, terms: [{ k: 5, amplitude: 0.2, phase: 1 }] }, 97);
      const frame = frameStimuli([contour], render);
      const pair = stimulusSvgPair(contour, frame, render);
      expect(pair.physical).toBe(stimulusSvg(contour, frame, render));
      expect(pair.pixels).toBe(stimulusSvg(contour, frame, render, { units: 'pixels' }));
      expect(pair.physical).not.toBe(pair.pixels);
    }
  });

  it('refuses stimuli that reach past the canvas', () => {
    const render = resolveRender(PROFILE, options({ sizeMeasure: 'equal-area-diameter', sizeDeg: 5, canvasDeg: 5 }));
    const contour = synthesizeContour({ family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.3, phase: 0 }] }, 128);
    expect(() => frameStimuli([contour], render, ['r01-s01'])).toThrow(/r01-s01/);
  });
});
