'use client';

import { useEffect, useRef, useState } from 'react';
import { CARD_HEIGHT_MM, DISTANCE_RANGE_CM, distanceFromBlindSpotCm, isPlausibleDistanceCm, pixelsPerMm } from '@/lib/take/screen-geometry';

const SWEEPS = 3;
/** The sweeping dot's speed in mm per second. */
const SWEEP_MM_PER_S = 30;
const REFRESH_FRAMES = 90;

export interface ScreenCheck {
  pxPerMm: number;
  viewingDistanceCm: number;
  distanceMethod: 'typed' | 'blind-spot';
  refreshHz: number;
  isFullScreen: boolean;
}

/** Median frame interval over `frames` animation frames, as a rate in Hz. */
function measureRefresh(frames: number): Promise<number> {
  return new Promise((resolve) => {
    const times: number[] = [];
    const tick = (t: number) => {
      times.push(t);
      if (times.length <= frames) requestAnimationFrame(tick);
      else {
        const gaps = times.slice(1).map((v, i) => v - times[i]!).sort((a, b) => a - b);
        resolve(1000 / gaps[Math.floor(gaps.length / 2)]!);
      }
    };
    requestAnimationFrame(tick);
  });
}

/** Screen check: card sizing (px/mm), viewing distance (typed or blind-spot sweep), refresh rate, full screen. */
export function ParticipantScreenCheck({ onDone }: { onDone: (check: ScreenCheck) => void }) {
  const [cardPx, setCardPx] = useState(320);
  const [refreshHz, setRefreshHz] = useState<number | null>(null);
  const [method, setMethod] = useState<'typed' | 'blind-spot'>('typed');
  const [typedCm, setTypedCm] = useState('');
  const [sweeps, setSweeps] = useState<number[]>([]);
  const [isSweeping, setIsSweeping] = useState(false);
  const [dotPx, setDotPx] = useState(0);
  const [error, setError] = useState<string | null>(null);
  const sweepRef = useRef<{ start: number; raf: number } | null>(null);
  const pxPerMm = pixelsPerMm(cardPx);

  useEffect(() => {
    void measureRefresh(REFRESH_FRAMES).then(setRefreshHz);
  }, []);

  const stopSweep = () => {
    if (!sweepRef.current) return;
    cancelAnimationFrame(sweepRef.current.raf);
    sweepRef.current = null;
    setIsSweeping(false);
    // The last three sweeps count: one more replaces the oldest.
    setSweeps((s) => [...s, dotPx].slice(-SWEEPS));
    setError(null);
  };
  const startSweep = () => {
    setIsSweeping(true);
    const start = performance.now();
    const step = (t: number) => {
      const px = ((t - start) / 1000) * SWEEP_MM_PER_S * pxPerMm;
      setDotPx(px);
      if (sweepRef.current) sweepRef.current.raf = requestAnimationFrame(step);
    };
    sweepRef.current = { start, raf: requestAnimationFrame(step) };
  };
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.key === ' ' && isSweeping) {
        e.preventDefault();
        stopSweep();
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  });

  const sweepCm = distanceFromBlindSpotCm(sweeps, pxPerMm);
  const distanceCm = method === 'typed' ? Number(typedCm) : sweeps.length >= SWEEPS ? sweepCm : null;

  const finish = async () => {
    if (!isPlausibleDistanceCm(distanceCm)) {
      setError(method === 'typed' ? `Type your viewing distance in centimetres (${DISTANCE_RANGE_CM.min} to ${DISTANCE_RANGE_CM.max}).` : `Do the sweep ${SWEEPS} times first.`);
      return;
    }
    try {
      if (!document.fullscreenElement) await document.documentElement.requestFullscreen?.();
    } catch {
      // Some browsers (and phones) refuse full screen; the session records that it was not full screen.
    }
    onDone({ pxPerMm, viewingDistanceCm: distanceCm, distanceMethod: method, refreshHz: refreshHz ?? 60, isFullScreen: Boolean(document.fullscreenElement) });
  };

  return (
    <section className="space-y-8" aria-labelledby="screen-title">
      <h1 id="screen-title" className="text-2xl font-semibold">Check your screen</h1>
      <div className="space-y-3">
        <h2 className="text-lg font-medium">1. Size of the screen</h2>
        <p>Hold a bank card, ID card or any card of that standard size against the screen. Drag the slider until the outline below is exactly as wide as your card.</p>
        <div data-testid="card-outline" className="rounded-lg border-2 border-graphite" style={{ width: cardPx, height: CARD_HEIGHT_MM * pxPerMm }} />
        <label className="block">
          <span className="block text-sm">Card width on screen (px)</span>
          <input type="range" min={120} max={900} value={cardPx} onChange={(e) => setCardPx(Number(e.target.value))} className="w-full max-w-md" data-testid="card-size" aria-valuetext={`${cardPx} pixels`} />
        </label>
        <p className="font-mono text-sm tabular-nums">{pxPerMm.toFixed(2)} px per mm</p>
      </div>

      <div className="space-y-3">
        <h2 className="text-lg font-medium">2. Distance from the screen</h2>
        <fieldset className="flex gap-6">
          <legend className="sr-only">How to give the distance</legend>
          <label><input type="radio" name="method" checked={method === 'typed'} onChange={() => { setMethod('typed'); setError(null); }} data-testid="distance-typed" /> I will type it</label>
          <label><input type="radio" name="method" checked={method === 'blind-spot'} onChange={() => { setMethod('blind-spot'); setError(null); }} data-testid="distance-blind-spot" /> Estimate it for me</label>
        </fieldset>
        {method === 'typed' ? (
          <label className="block">
            <span className="block text-sm">Distance from your eyes to the screen (cm)</span>
            <input type="number" inputMode="decimal" value={typedCm} onChange={(e) => setTypedCm(e.target.value)} className="w-32 border border-graphite/40 px-2 py-1" data-testid="distance-cm" />
          </label>
        ) : (
          <div className="space-y-2">
            <p>Sit as you will sit for the task. Close your right eye and look at the black square with your left eye only. Press the button (or the space bar): a red dot moves away to the left. Keep looking at the square, and press the space bar (or tap the button) the moment the dot vanishes. Do this {SWEEPS} times.</p>
            <div className="relative h-24 w-full overflow-hidden border border-graphite/20" aria-hidden="true">
              <div className="absolute top-1/2 h-4 w-4 -translate-y-1/2 bg-graphite" style={{ right: 40 }} />
              {isSweeping && <div className="absolute top-1/2 h-4 w-4 -translate-y-1/2 rounded-full bg-category-vermilion" style={{ right: 40 + dotPx }} />}
            </div>
            <button type="button" className="rounded border border-accent px-3 py-1" onClick={isSweeping ? stopSweep : startSweep} data-testid="sweep">
              {isSweeping ? 'The dot vanished' : sweeps.length >= SWEEPS ? 'Sweep once more' : `Start sweep ${sweeps.length + 1} of ${SWEEPS}`}
            </button>
            {sweepCm !== null && <p className="font-mono text-sm tabular-nums" data-testid="sweep-estimate" data-separations-px={sweeps.join(' ')} data-px-per-mm={pxPerMm}>Estimated distance so far: {sweepCm.toFixed(0)} cm</p>}
          </div>
        )}
      </div>

      <div className="space-y-2">
        <h2 className="text-lg font-medium">3. Refresh rate</h2>
        <p className="font-mono text-sm tabular-nums" data-testid="refresh">{refreshHz ? `${refreshHz.toFixed(1)} Hz` : 'Measuring…'}</p>
      </div>

      {error && <p role="alert" className="text-danger">{error}</p>}
      <button type="button" onClick={() => void finish()} disabled={!refreshHz} className="rounded bg-accent px-4 py-2 text-white disabled:opacity-50" data-testid="screen-done">
        Continue in full screen
      </button>
    </section>
  );
}
