'use client';

import { useState } from 'react';
import { isProblemDetails } from '@/lib/errors';
import type { PackCheckResult } from '@/lib/schemas/pack-check';
import { Button } from './ui/button';
import { Notice } from './ui/notice';

/** The server refuses larger zips; checking first saves a pointless upload. */
const MAX_ZIP_BYTES = 600 * 1024 * 1024;

type Mode = 'zip' | 'manifest';

const VERDICT_TEXT: Record<PackCheckResult['verdict'], { title: string; tone: 'info' | 'caution' | 'error' }> = {
  intact: { title: 'Intact', tone: 'info' },
  inconsistent: { title: 'Intact files, but problems found', tone: 'caution' },
  incomplete: { title: 'Files missing', tone: 'error' },
  altered: { title: 'Altered', tone: 'error' },
  unreadable: { title: 'Nothing to check against', tone: 'error' },
};

const EDITION_TONE: Record<PackCheckResult['edition']['status'], 'info' | 'caution' | 'error'> = { matches: 'info', differs: 'caution', unknown: 'caution', 'no-claim': 'caution' };

const fileInputClass = 'mt-1 block text-sm font-normal';

async function send(lab: string, body: BodyInit, type: string): Promise<PackCheckResult> {
  const res = await fetch(`/api/v1/labs/${lab}/pack-checks`, { method: 'POST', headers: { 'content-type': type }, body, credentials: 'same-origin' });
  const data: unknown = await res.json().catch(() => undefined);
  if (!res.ok) throw new Error(isProblemDetails(data) ? data.detail : `The server answered ${res.status}.`);
  return data as PackCheckResult;
}

/** Upload a pack zip, or a manifest with its SHA256SUMS, and show what the pack check found. */
export function PackCheckForm({ lab }: { lab: string }) {
  const [mode, setMode] = useState<Mode>('zip');
  const [zip, setZip] = useState<File | null>(null);
  const [manifest, setManifest] = useState<File | null>(null);
  const [sums, setSums] = useState<File | null>(null);
  const [result, setResult] = useState<PackCheckResult | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const ready = mode === 'zip' ? zip !== null : manifest !== null && sums !== null;

  const run = async () => {
    setError(null);
    setResult(null);
    if (mode === 'zip' && zip && zip.size > MAX_ZIP_BYTES) {
      setError(`The zip is ${Math.round(zip.size / 1048576)} MiB; the limit is 600 MiB.`);
      return;
    }
    setBusy(true);
    try {
      if (mode === 'zip' && zip) setResult(await send(lab, zip, 'application/zip'));
      else if (manifest && sums) setResult(await send(lab, JSON.stringify({ manifest: await manifest.text(), sums: await sums.text() }), 'application/json'));
    } catch (e) {
      setError(e instanceof Error ? e.message : 'The check failed.');
    } finally {
      setBusy(false);
    }
  };

  return (
    <div className="max-w-4xl space-y-8">
      <section aria-labelledby="check-input-heading" className="space-y-4">
        <h2 id="check-input-heading" className="sr-only">
          What to check
        </h2>
        <fieldset className="flex flex-wrap gap-6 text-sm">
          <legend className="mb-2 text-sm font-medium text-graphite">Check</legend>
          <label className="flex items-center gap-2">
            <input type="radio" name="check-mode" value="zip" checked={mode === 'zip'} onChange={() => setMode('zip')} data-testid="check-mode-zip" />
            The whole pack (zip)
          </label>
          <label className="flex items-center gap-2">
            <input type="radio" name="check-mode" value="manifest" checked={mode === 'manifest'} onChange={() => setMode('manifest')} data-testid="check-mode-manifest" />
            manifest.json and SHA256SUMS only
          </label>
        </fieldset>
        {mode === 'zip' ? (
          <label className="block text-sm font-medium">
            Pack zip
            <input type="file" accept=".zip,application/zip" className={fileInputClass} onChange={(e) => setZip(e.target.files?.[0] ?? null)} data-testid="check-zip" aria-describedby="check-zip-hint" />
            <span id="check-zip-hint" className="mt-1 block text-xs font-normal text-graphite-muted">
              At most 600 MiB; the pack exactly as downloaded, or zipped again inside one folder.
            </span>
          </label>
        ) : (
          <div className="flex flex-wrap gap-6">
            <label className="block text-sm font-medium">
              manifest.json
              <input type="file" accept=".json,application/json" className={fileInputClass} onChange={(e) => setManifest(e.target.files?.[0] ?? null)} data-testid="check-manifest" />
            </label>
            <label className="block text-sm font-medium">
              SHA256SUMS
              <input type="file" className={fileInputClass} onChange={(e) => setSums(e.target.files?.[0] ?? null)} data-testid="check-sums" />
            </label>
          </div>
        )}
        <Button onClick={run} disabled={!ready || busy} data-testid="check-run">
          {busy ? 'Checking…' : 'Check'}
        </Button>
        {busy ? (
          <p role="status" className="text-sm text-graphite-soft">
            Reading and hashing every file…
          </p>
        ) : null}
      </section>

      {error ? (
        <Notice tone="error" testId="check-error">
          <p className="font-medium">The pack could not be checked.</p>
          <p>{error}</p>
        </Notice>
      ) : null}

      {result ? <PackCheckReportView result={result} /> : null}
    </div>
  );
}

function PackCheckReportView({ result }: { result: PackCheckResult }) {
  const verdict = VERDICT_TEXT[result.verdict];
  const counts: [string, number, string][] = [
    ['Listed', result.counts.listed, 'listed'],
    ['Intact', result.counts.intact, 'intact'],
    ['Altered', result.counts.altered, 'altered'],
    ['Missing', result.counts.missing, 'missing'],
    ['Extra', result.counts.extra, 'extra'],
  ];
  return (
    <section aria-labelledby="check-report-heading" className="space-y-6" data-testid="check-report" data-verdict={result.verdict}>
      <h2 id="check-report-heading" className="text-lg font-semibold">
        Report
      </h2>
      <Notice tone={verdict.tone} testId="check-verdict">
        <p className="font-medium">{verdict.title}</p>
        <p>{result.summary}</p>
      </Notice>
      <dl className="grid grid-cols-5 gap-4 border-y-[0.5px] border-rule py-3 text-sm">
        {counts.map(([label, n, id]) => (
          <div key={id}>
            <dt className="text-graphite-soft">{label}</dt>
            <dd className="tabular text-lg" data-testid={`check-count-${id}`}>
              {n}
            </dd>
          </div>
        ))}
      </dl>
      <div data-testid="check-edition" data-status={result.edition.status}>
        <h3 className="mb-2 text-sm font-medium">Edition</h3>
        <Notice tone={EDITION_TONE[result.edition.status]}>
          <p>{result.edition.message}</p>
          {result.edition.claimed ? (
            <p className="mt-1 text-xs text-graphite-soft">
              The manifest says: {result.edition.claimed.spaceName}, edition {result.edition.claimed.number} ({result.edition.claimed.state.replace('_', ' ')}), content hash{' '}
              <span className="tabular font-mono">{result.edition.claimed.contentHash}</span>
            </p>
          ) : null}
        </Notice>
      </div>
      {result.altered.length > 0 ? (
        <div>
          <h3 className="mb-2 text-sm font-medium">Altered files</h3>
          <table className="w-full border-collapse text-sm" data-testid="check-altered">
            <thead>
              <tr className="border-b-[0.5px] border-rule-strong text-left text-graphite-soft">
                <th scope="col" className="py-2 pr-4 font-medium">File</th>
                <th scope="col" className="py-2 pr-4 font-medium">Listed SHA-256</th>
                <th scope="col" className="py-2 pr-4 font-medium">SHA-256 found</th>
              </tr>
            </thead>
            <tbody>
              {result.altered.map((a) => (
                <tr key={a.path} className="border-b-[0.5px] border-rule">
                  <td className="py-2 pr-4 font-mono text-xs">{a.path}</td>
                  <td className="py-2 pr-4 font-mono text-xs break-all">{a.expected}</td>
                  <td className="py-2 pr-4 font-mono text-xs break-all">{a.actual}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
      {result.problems.length > 0 ? (
        <div>
          <h3 className="mb-2 text-sm font-medium">Every problem found</h3>
          <ul className="space-y-1 text-sm" data-testid="check-problems">
            {result.problems.map((p, i) => (
              <li key={`${p.code}-${p.path ?? ''}-${i}`} data-code={p.code} className="border-b-[0.5px] border-rule py-1">
                {p.message}
              </li>
            ))}
          </ul>
          {result.problemsLeftOff > 0 ? <p className="mt-2 text-xs text-graphite-muted">…and {result.problemsLeftOff} more of the same kinds.</p> : null}
        </div>
      ) : null}
    </section>
  );
}
