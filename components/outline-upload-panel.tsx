'use client';

import { useState } from 'react';
import { ApiError } from '@/lib/api-client';
import { isProblemDetails } from '@/lib/errors';
import type { FitResult } from '@/lib/schemas/seed-shapes';
import { ShapePreview } from './shape-preview';
import { Button } from './ui/button';
import { Notice } from './ui/notice';

/** The server refuses more; checking first saves a pointless upload. */
const MAX_UPLOAD_BYTES = 1024 * 1024;

/** Upload an SVG or CSV outline; the server fits harmonics and answers with an overlay and the error. */
export function OutlineUploadPanel({ lab, onUse }: { lab: string; onUse: (fit: FitResult, fileName: string, harmonics: number) => void }) {
  const [file, setFile] = useState<File | null>(null);
  const [family, setFamily] = useState<'elliptic' | 'radial'>('elliptic');
  const [harmonics, setHarmonics] = useState(12);
  const [fit, setFit] = useState<FitResult | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const run = async () => {
    if (!file) return;
    setError(null);
    setFit(null);
    if (file.size > MAX_UPLOAD_BYTES) {
      setError(`The file is ${(file.size / 1024).toFixed(0)} KiB; the limit is 1024 KiB.`);
      return;
    }
    setBusy(true);
    try {
      const isSvg = /\.svg$/i.test(file.name) || file.type === 'image/svg+xml';
      const q = new URLSearchParams({ family, harmonics: String(harmonics), fileName: file.name.slice(0, 200) });
      const res = await fetch(`/api/v1/labs/${lab}/seed-shapes/fit?${q}`, {
        method: 'POST',
        headers: { 'content-type': isSvg ? 'image/svg+xml' : 'text/csv' },
        body: await file.text(),
      });
      const data: unknown = await res.json().catch(() => undefined);
      if (!res.ok) throw new ApiError(isProblemDetails(data) ? data : { type: '', title: '', status: res.status, detail: `The server answered ${res.status}.`, code: 'internal:server' });
      setFit(data as FitResult);
    } catch (e) {
      setError(e instanceof Error ? e.message : 'The upload failed.');
    } finally {
      setBusy(false);
    }
  };

  return (
    <section aria-labelledby="upload-heading" className="border-t-[0.5px] border-rule pt-6" data-testid="upload-panel">
      <h2 id="upload-heading" className="text-lg font-semibold">
        Fit harmonics to an outline
      </h2>
      <p className="mt-1 text-sm text-graphite-soft">
        An SVG (at most 1 MiB, plain path data only) or a CSV of x,y points. Only the fitted harmonics are kept; the file
        itself is never stored.
      </p>
      <div className="mt-4 flex flex-wrap items-end gap-4">
        <label className="text-sm font-medium">
          Outline file
          <input
            type="file"
            accept=".svg,.csv,image/svg+xml,text/csv"
            onChange={(e) => {
              setFile(e.target.files?.[0] ?? null);
              setFit(null);
              setError(null);
            }}
            className="mt-1 block text-sm font-normal"
            data-testid="upload-file"
          />
        </label>
        <label className="text-sm font-medium">
          Family
          <select value={family} onChange={(e) => setFamily(e.target.value as 'elliptic' | 'radial')} className="mt-1 block h-9 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm font-normal" data-testid="upload-family">
            <option value="elliptic">Elliptic harmonics</option>
            <option value="radial">Radial harmonics</option>
          </select>
        </label>
        <label className="text-sm font-medium">
          Harmonics
          <input
            type="number"
            min={1}
            max={64}
            value={harmonics}
            onChange={(e) => setHarmonics(Math.max(1, Math.min(64, Number(e.target.value) || 1)))}
            className="tabular mt-1 block h-9 w-20 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm font-normal"
            data-testid="upload-harmonics"
          />
        </label>
        <Button onClick={run} disabled={!file || busy} data-testid="upload-fit">
          {busy ? 'Fitting…' : 'Fit'}
        </Button>
      </div>
      {error ? (
        <div className="mt-4">
          <Notice tone="error" testId="upload-error">{error}</Notice>
        </div>
      ) : null}
      {fit ? (
        <div className="mt-6 grid gap-6 md:grid-cols-[20rem_1fr]" data-testid="fit-result">
          <div className="border-[0.5px] border-rule bg-paper-raised">
            <ShapePreview
              label="The uploaded outline (dashed) with the fitted contour (teal)"
              size="100%"
              paths={[
                { d: fit.fittedPath, fill: 'rgba(14,93,99,0.18)', stroke: '#0E5D63', testId: 'fit-path' },
                { d: fit.outlinePath, stroke: '#23262B', dashed: true, testId: 'outline-path' },
              ]}
            />
          </div>
          <div className="space-y-3 text-sm">
            <p>
              Reconstruction error, in units of the outline’s equal-area radius: mean{' '}
              <span className="tabular" data-testid="fit-mean-error">{fit.meanError.toFixed(4)}</span>, max{' '}
              <span className="tabular" data-testid="fit-max-error">{fit.maxError.toFixed(4)}</span>.
            </p>
            {fit.notes.map((n) => (
              <Notice key={n} testId="fit-note">{n}</Notice>
            ))}
            <Button onClick={() => onUse(fit, file?.name ?? 'outline', harmonics)} data-testid="use-fit">
              Use this fit
            </Button>
          </div>
        </div>
      ) : null}
    </section>
  );
}
