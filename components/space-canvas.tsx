'use client';

import { useEffect, useRef, type ReactNode } from 'react';
import type { Contour } from '@/lib/shape/types';
import { rasterizeOutline } from '@/lib/render/rasterize-outline';
import { parseHexColour } from '@/lib/render/parse-hex-colour';

/** Where the space sits on the view: `toPx` maps (a, b) to view px; the circle of radius ρmax has `radiusPx`. */
export interface SpaceGeometry {
  size: number;
  toPx: (a: number, b: number) => [number, number];
  radiusPx: number;
}

export interface CanvasStimulus {
  id: string;
  /** Designed coordinates, in axis units. */
  a: number;
  b: number;
  contour: Contour | null;
  color?: string;
}

/** Space units on screen: the layout fills the canvas with this margin, as a fraction of ρmax. */
const MARGIN = 0.14;

/**
 * Every stimulus of a space drawn on one canvas at its (a, b) position, with one common scale so sizes compare
 * truly (equal aspect). A click selects the nearest stimulus. `onDrawn(ms)` reports the synthesis-free draw time.
 */
export function SpaceCanvas({
  stimuli,
  extent,
  circular,
  selectedId,
  onSelect,
  size = 640,
  onDrawn,
  overlay,
}: {
  stimuli: readonly CanvasStimulus[];
  extent: number;
  circular: boolean;
  selectedId: string | null;
  onSelect: (id: string) => void;
  size?: number;
  onDrawn?: (ms: number) => void;
  /** Drawn over the space in an SVG with the canvas's own coordinates (CSS px of `size`). */
  overlay?: (geometry: SpaceGeometry) => ReactNode;
}) {
  const back = useRef<HTMLCanvasElement>(null);
  const ref = useRef<HTMLCanvasElement>(null);
  const image = useRef<{ img: ImageData; words: Uint32Array }>(null);
  const geometry = useRef<{ toPx: (a: number, b: number) => [number, number] }>(null);

  // The frame (the circle of radius ρmax or the lattice square, and the two axes) on the canvas underneath.
  useEffect(() => {
    const canvas = back.current;
    const ctx = canvas ? prepare(canvas, size) : null;
    if (!ctx) return;
    const half = size / 2;
    const r = extent * unitOf(size, extent);
    ctx.strokeStyle = '#DDD6C8';
    ctx.lineWidth = 1;
    ctx.beginPath();
    if (circular) ctx.arc(half, half, r, 0, 2 * Math.PI);
    else ctx.rect(half - r, half - r, 2 * r, 2 * r);
    ctx.moveTo(half - r, half);
    ctx.lineTo(half + r, half);
    ctx.moveTo(half, half - r);
    ctx.lineTo(half, half + r);
    ctx.stroke();
  }, [extent, circular, size]);

  useEffect(() => {
    const canvas = ref.current;
    if (!canvas) return;
    const t0 = performance.now();
    const ctx = prepare(canvas, size);
    if (!ctx) return;
    const dpr = canvas.width / size;

    const half = size / 2;
    const unit = unitOf(size, extent);
    const toPx = (a: number, b: number): [number, number] => [half + a * unit, half - b * unit];
    geometry.current = { toPx };

    // One scale for every thumbnail: the largest outline fits the smallest spacing between stimuli.
    let maxR = 0;
    for (const s of stimuli) {
      const c = s.contour;
      if (!c) continue;
      for (let i = 0; i < c.x.length; i++) maxR = Math.max(maxR, c.x[i]! * c.x[i]! + c.y[i]! * c.y[i]!);
    }
    maxR = Math.sqrt(maxR);
    const spacing = minSpacing(stimuli) * unit;
    const scale = maxR > 0 ? (0.46 * Math.max(spacing, 6)) / maxR : 1;

    // Every outline, all its vertices, scan-converted into one reused ImageData (faster than per-path fill():
    // see lib/render/rasterize-outline.ts), then put in one call.
    if (!image.current || image.current.img.width !== canvas.width || image.current.img.height !== canvas.height) {
      const created = ctx.createImageData(canvas.width, canvas.height);
      image.current = { img: created, words: new Uint32Array(created.data.buffer) };
    }
    const { img, words } = image.current;
    words.fill(0);
    const target = { data: img.data, width: img.width, height: img.height };
    const failed: [number, number][] = [];
    for (const s of stimuli) {
      const [px, py] = toPx(s.a, s.b);
      if (!s.contour) {
        failed.push([px, py]);
        continue;
      }
      const rgb = s.color ? colourOf(s.color) : INK;
      rasterizeOutline(target, { x: s.contour.x, y: s.contour.y, originX: px * dpr, originY: py * dpr, scale: scale * dpr, rgb });
    }
    ctx.putImageData(img, 0, 0);
    ctx.fillStyle = '#A63F00';
    for (const [px, py] of failed) ctx.fillRect(px - 2, py - 2, 4, 4);
    const chosen = stimuli.find((s) => s.id === selectedId);
    if (chosen) {
      const [px, py] = toPx(chosen.a, chosen.b);
      ctx.strokeStyle = '#0E5D63';
      ctx.lineWidth = 2;
      ctx.beginPath();
      ctx.arc(px, py, maxR * scale + 4, 0, 2 * Math.PI);
      ctx.stroke();
    }
    onDrawn?.(performance.now() - t0);
  }, [stimuli, extent, circular, selectedId, size, onDrawn]);

  const pick = (clientX: number, clientY: number) => {
    const canvas = ref.current;
    const g = geometry.current;
    if (!canvas || !g) return;
    const rect = canvas.getBoundingClientRect();
    const x = ((clientX - rect.left) / rect.width) * size;
    const y = ((clientY - rect.top) / rect.height) * size;
    let best: string | null = null;
    let bestD = Infinity;
    for (const s of stimuli) {
      const [px, py] = g.toPx(s.a, s.b);
      const d = (px - x) ** 2 + (py - y) ** 2;
      if (d < bestD) {
        bestD = d;
        best = s.id;
      }
    }
    if (best) onSelect(best);
  };

  return (
    <div className="relative w-full" style={{ maxWidth: size, aspectRatio: '1 / 1' }}>
      <canvas ref={back} aria-hidden="true" className="absolute inset-0 h-full w-full" />
      <canvas
        ref={ref}
        className="absolute inset-0 h-full w-full"
        onClick={(e) => pick(e.clientX, e.clientY)}
        role="img"
        aria-label={`The shape space: ${stimuli.length} stimuli. Choose one with the stimulus list below the view, or click it.`}
        data-testid="space-canvas"
        data-stimuli={stimuli.length}
      />
      {overlay ? (
        <svg viewBox={`0 0 ${size} ${size}`} className="pointer-events-none absolute inset-0 h-full w-full" aria-hidden={false}>
          {overlay({ size, toPx: (a, b) => [size / 2 + a * unitOf(size, extent), size / 2 - b * unitOf(size, extent)], radiusPx: extent * unitOf(size, extent) })}
        </svg>
      ) : null}
    </div>
  );
}

const INK: [number, number, number] = [0x23, 0x26, 0x2b];
const colours = new Map<string, [number, number, number]>();
function colourOf(hex: string): [number, number, number] {
  let c = colours.get(hex);
  if (!c) colours.set(hex, (c = parseHexColour(hex, INK)));
  return c;
}

function unitOf(size: number, extent: number): number {
  return size / 2 / (extent * (1 + MARGIN));
}

/** Sizes the canvas backing store for the device pixel ratio and returns a cleared context in CSS pixels. */
function prepare(canvas: HTMLCanvasElement, size: number): CanvasRenderingContext2D | null {
  const dpr = window.devicePixelRatio || 1;
  const px = Math.round(size * dpr);
  if (canvas.width !== px) {
    canvas.width = px;
    canvas.height = px;
  }
  const ctx = canvas.getContext('2d');
  if (!ctx) return null;
  ctx.setTransform(px / size, 0, 0, px / size, 0, 0);
  ctx.clearRect(0, 0, size, size);
  return ctx;
}

function minSpacing(stimuli: readonly CanvasStimulus[]): number {
  // Nearest-neighbour distance, sampled over the first stimuli (enough for regular layouts).
  let best = Infinity;
  const n = Math.min(stimuli.length, 64);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < stimuli.length; j++) {
      if (i === j) continue;
      const d = Math.hypot(stimuli[i]!.a - stimuli[j]!.a, stimuli[i]!.b - stimuli[j]!.b);
      if (d > 0 && d < best) best = d;
    }
  }
  return Number.isFinite(best) ? best : 1;
}
