'use client';

import { useEffect, useRef } from 'react';

/** Sequential colour ramp from paper to deep teal (0 → similar, 1 → most dissimilar). */
function ramp(t: number): [number, number, number] {
  const a = [250, 247, 240];
  const b = [14, 93, 99];
  const u = Math.max(0, Math.min(1, t));
  return [a[0]! + (b[0]! - a[0]!) * u, a[1]! + (b[1]! - a[1]!) * u, a[2]! + (b[2]! - a[2]!) * u];
}

/** An RDM drawn as a square heatmap, one pixel per cell, scaled to its own maximum. */
export function RdmHeatmap({ size, values, label, testId }: { size: number; values: Float64Array; label: string; testId?: string }) {
  const ref = useRef<HTMLCanvasElement>(null);
  useEffect(() => {
    const canvas = ref.current;
    const ctx = canvas?.getContext('2d');
    if (!canvas || !ctx || size === 0) return;
    canvas.width = size;
    canvas.height = size;
    let max = 0;
    for (const v of values) if (Number.isFinite(v)) max = Math.max(max, v);
    const img = ctx.createImageData(size, size);
    for (let i = 0; i < size * size; i++) {
      const [r, g, b] = ramp(max > 0 ? values[i]! / max : 0);
      img.data[4 * i] = r;
      img.data[4 * i + 1] = g;
      img.data[4 * i + 2] = b;
      img.data[4 * i + 3] = 255;
    }
    ctx.putImageData(img, 0, 0);
  }, [size, values]);
  return (
    <figure className="space-y-1">
      <canvas ref={ref} role="img" aria-label={label} data-testid={testId} style={{ width: '100%', maxWidth: 220, aspectRatio: '1 / 1', imageRendering: 'pixelated' }} className="border-[0.5px] border-rule" />
      <figcaption className="text-xs text-graphite-soft">{label}</figcaption>
    </figure>
  );
}
