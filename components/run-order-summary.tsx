'use client';

import { useMemo } from 'react';
import type { RunOrderResultValue } from '@/lib/schemas/run-order';
import { RdmHeatmap } from './rdm-heatmap';
import { Notice } from './ui/notice';

const seconds = (s: number) => {
  const m = Math.floor(s / 60);
  return m > 0 ? `${m} min ${(s - 60 * m).toFixed(1)} s` : `${s.toFixed(1)} s`;
};

/** A built run order's figures: totals, the flash check, lost pairs, runs, counts per condition and the transitions. */
export function RunOrderSummary({ result, tr, testId = 'run-order-summary' }: { result: RunOrderResultValue; tr: number; testId?: string }) {
  const { summary, conditions, runs, lostPairs } = result;
  const n = conditions.length;
  const cells = useMemo(() => Float64Array.from(summary.transitionCounts.flat()), [summary.transitionCounts]);
  const flat = summary.transitionCounts.flat();
  const lo = flat.length ? Math.min(...flat) : 0;
  const hi = flat.length ? Math.max(...flat) : 0;
  return (
    <section aria-labelledby={`${testId}-heading`} className="space-y-4 text-sm" data-testid={testId}>
      <h2 id={`${testId}-heading`} className="text-base font-semibold">
        Summary
      </h2>
      <dl className="tabular grid max-w-2xl grid-cols-2 gap-x-6 gap-y-1 sm:grid-cols-4">
        <dt className="text-graphite-soft">Trials</dt>
        <dd data-testid="summary-trials">{summary.trials}</dd>
        <dt className="text-graphite-soft">Total duration</dt>
        <dd data-testid="summary-duration">{seconds(summary.duration)}</dd>
        <dt className="text-graphite-soft">Stored volumes (TR {tr} s)</dt>
        <dd data-testid="summary-volumes">{summary.volumes}</dd>
        <dt className="text-graphite-soft">Volumes to acquire</dt>
        <dd>{summary.acquiredVolumes}</dd>
        <dt className="text-graphite-soft">Conditions</dt>
        <dd>{n}</dd>
        <dt className="text-graphite-soft">Peak onset rate</dt>
        <dd data-testid="summary-peak-rate">{summary.peakOnsetRate} per s</dd>
      </dl>
      {summary.exceedsFlashLimit ? (
        <Notice tone="caution" testId="flash-warning">
          <strong>Flash check:</strong> up to {summary.peakOnsetRate} stimulus onsets fall within one second, more than the 3 per second that WCAG 2.3.1 allows. Lengthen the trial or the ITI. Flashing displays
          can trigger seizures in people with photosensitive epilepsy: tell participants before the session, follow your ethics board’s rules, and stop if anyone feels unwell.
        </Notice>
      ) : (
        <p className="text-xs text-graphite-soft" data-testid="flash-ok">
          Flash check: at most {summary.peakOnsetRate} onset{summary.peakOnsetRate === 1 ? "" : "s"} in any second (WCAG 2.3.1 allows 3). Participants who are sensitive to flicker should still be told what they will see.
        </p>
      )}
      {lostPairs.length > 0 ? (
        <div data-testid="lost-pairs">
          <h3 className="font-medium">Transitions lost at the cuts</h3>
          <p className="text-xs text-graphite-soft">One long sequence was cut into runs, so these ordered pairs are never shown one after the other.</p>
          <ul className="tabular mt-1 list-disc pl-5">
            {lostPairs.map((p) => (
              <li key={p.afterRun}>
                after run {p.afterRun}: {p.fromId} → {p.toId}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Runs (scrolls sideways)">
        <table className="tabular min-w-[28rem] text-left text-xs" data-testid="run-table">
          <caption className="mb-1 text-left text-sm font-medium">Runs</caption>
          <thead>
            <tr className="border-b-[0.5px] border-rule">
              <th scope="col" className="py-1 pr-4 font-medium">Run</th>
              <th scope="col" className="py-1 pr-4 font-medium">File</th>
              <th scope="col" className="py-1 pr-4 font-medium">Trials</th>
              <th scope="col" className="py-1 pr-4 font-medium">Duration</th>
              <th scope="col" className="py-1 pr-4 font-medium">Volumes</th>
            </tr>
          </thead>
          <tbody>
            {runs.map((r) => (
              <tr key={r.index} className="border-b-[0.5px] border-rule">
                <td className="py-1 pr-4">{r.index}</td>
                <td className="py-1 pr-4 font-mono">{r.fileName}</td>
                <td className="py-1 pr-4">{r.trials}</td>
                <td className="py-1 pr-4">{seconds(r.duration)}</td>
                <td className="py-1 pr-4">{r.volumes}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="flex flex-wrap gap-8">
        <div className="max-h-72 overflow-y-auto" tabIndex={0} role="region" aria-label="Trials per condition (scrolls)">
          <table className="tabular text-left text-xs" data-testid="condition-counts">
            <caption className="mb-1 text-left text-sm font-medium">Trials per condition</caption>
            <thead>
              <tr className="border-b-[0.5px] border-rule">
                <th scope="col" className="py-1 pr-4 font-medium">trial_type</th>
                <th scope="col" className="py-1 pr-4 font-medium">stim_file</th>
                <th scope="col" className="py-1 pr-4 font-medium">Trials</th>
              </tr>
            </thead>
            <tbody>
              {conditions.map((c, i) => (
                <tr key={c.id} className="border-b-[0.5px] border-rule">
                  <td className="py-0.5 pr-4 font-mono">{c.id}</td>
                  <td className="py-0.5 pr-4 font-mono">{c.stimFile ?? 'n/a'}</td>
                  <td className="py-0.5 pr-4">{summary.conditionCounts[i]}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <div className="w-56" data-testid="transition-heatmap">
          <RdmHeatmap size={n} values={cells} label={`First-order transitions, ${n} × ${n} (row: trial, column: the next one)`} />
          <p className="tabular mt-1 text-xs" data-testid="transition-flatness">
            {summary.isTransitionFlat ? `Flat: every ordered pair follows ${lo} time${lo === 1 ? '' : 's'}.` : `Not flat: pairs follow ${lo} to ${hi} times.`}
          </p>
        </div>
      </div>
    </section>
  );
}
