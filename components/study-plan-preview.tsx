'use client';

import { useQuery } from '@tanstack/react-query';
import { Fragment, useState } from 'react';
import { apiFetch } from '@/lib/api-client';
import type { StudyValue, TrialPlanValue } from '@/lib/schemas/study';
import { Notice } from './ui/notice';

/** How many of the first trials the "Try it yourself" preview lists. */
const FIRST_TRIALS = 12;

const fmt = (v: number, digits = 2) => (Math.round(v * 10 ** digits) / 10 ** digits).toString();

/**
 * Any participant's plan as the session will regenerate it: counts per direction and level (catch and practice
 * trials apart), stimulus use in the pairs, and the first trials.
 */
export function StudyPlanPreview({ lab, study }: { lab: string; study: StudyValue }) {
  const [participant, setParticipant] = useState(0);
  const plan = useQuery({
    queryKey: ['study-plan', study.id, study.version, participant],
    queryFn: () => apiFetch<TrialPlanValue>(`/api/v1/labs/${lab}/studies/${study.id}/plan?participant=${participant}`),
  });
  const cat = study.design.categorisation;
  const data = plan.data;
  const directions = cat?.directionsDeg ?? [];
  const levels = cat ? Array.from({ length: cat.steps }, (_, i) => i) : [];
  const cell = (d: number, l: number) => data?.summary.cells.find((c) => c.directionDeg === d && c.level === l);
  const use = data ? Object.values(data.summary.stimulusUse) : [];

  return (
    <section aria-labelledby="plan-heading" className="space-y-4" data-testid="plan-preview">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 id="plan-heading" className="text-lg font-semibold">
          Trial plan
        </h2>
        <label className="text-sm font-medium">
          Participant index
          <input
            type="number"
            min={0}
            value={participant}
            onChange={(e) => setParticipant(Math.max(0, Math.floor(Number(e.target.value) || 0)))}
            className="tabular ml-2 h-8 w-24 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm font-normal"
            data-testid="plan-participant"
          />
        </label>
      </div>
      <p className="text-sm text-graphite-soft">
        Index 0 is the first participant to join. The plan follows from the study seed (<span className="tabular">{study.design.seed}</span>) and the index, so a session can rebuild
        it exactly.
      </p>
      {plan.error ? <Notice tone="error">{plan.error.message}</Notice> : null}
      {data ? (
        <>
          <p className="tabular text-sm" data-testid="plan-summary">
            {data.summary.totalTrials} trials: {data.summary.categorisationTrials} categorisation, {data.summary.similarityTrials} similarity.
            {data.keys ? ` Keys: “${data.keys.left}” for the left endpoint, “${data.keys.right}” for the right.` : ''}
          </p>
          {cat ? (
            <div className="overflow-x-auto">
              <table className="tabular border-collapse text-xs" data-testid="plan-counts">
                <caption className="mb-2 text-left text-sm text-graphite-soft">Ordinary trials per direction and level (catch trials, on the endpoints, in brackets)</caption>
                <thead>
                  <tr className="border-b-[0.5px] border-rule-strong">
                    <th scope="col" className="py-1 pr-3 text-left font-medium">Direction</th>
                    {levels.map((l) => (
                      <th key={l} scope="col" className="px-2 py-1 text-right font-medium">
                        {l + 1}
                      </th>
                    ))}
                    <th scope="col" className="px-2 py-1 text-right font-medium">All</th>
                  </tr>
                </thead>
                <tbody>
                  {directions.map((d) => {
                    const row = levels.map((l) => cell(d, l));
                    const total = row.reduce((s, c) => s + (c?.trials ?? 0) + (c?.catchTrials ?? 0), 0);
                    return (
                      <tr key={d} className="border-b-[0.5px] border-rule" data-testid={`plan-row-${d}`}>
                        <th scope="row" className="py-1 pr-3 text-left font-normal">
                          {d}°
                        </th>
                        {row.map((c, l) => (
                          <td key={l} className="px-2 py-1 text-right">
                            {c?.trials ?? 0}
                            {c?.catchTrials ? <span className="text-graphite-muted"> ({c.catchTrials})</span> : null}
                          </td>
                        ))}
                        <td className="px-2 py-1 text-right font-medium">{total}</td>
                      </tr>
                    );
                  })}
                </tbody>
              </table>
            </div>
          ) : null}
          {use.length ? (
            <p className="tabular text-sm" data-testid="plan-stimulus-use">
              Pairs: {use.length} stimuli, each shown {Math.min(...use) === Math.max(...use) ? `${use[0]} times` : `${Math.min(...use)}–${Math.max(...use)} times`}.
            </p>
          ) : null}
          <div className="space-y-2 border-[0.5px] border-rule p-4" data-testid="try-it">
            <h3 className="font-semibold">First trials</h3>
            <p className="text-sm text-graphite-soft">
              This participant’s first {Math.min(FIRST_TRIALS, data.trials.length)} trials. To take the task yourself, open the invite link in a private window (your session then shows in the monitor; withdraw it at the end).
            </p>
            <table className="tabular w-full border-collapse text-xs" data-testid="first-trials">
              <thead>
                <tr className="border-b-[0.5px] border-rule-strong text-left">
                  <th scope="col" className="py-1 pr-3 font-medium">#</th>
                  <th scope="col" className="py-1 pr-3 font-medium">Block</th>
                  <th scope="col" className="py-1 pr-3 font-medium">Task</th>
                  <th scope="col" className="py-1 pr-3 font-medium">Shown</th>
                  <th scope="col" className="py-1 pr-3 font-medium">Answer</th>
                </tr>
              </thead>
              <tbody>
                {data.trials.slice(0, FIRST_TRIALS).map((t) => (
                  <tr key={t.index} className="border-b-[0.5px] border-rule">
                    <td className="py-1 pr-3">{t.index + 1}</td>
                    <td className="py-1 pr-3">{t.block + 1}</td>
                    {t.task === 'categorisation' ? (
                      <Fragment>
                        <td className="py-1 pr-3">{t.isPractice ? 'Practice' : t.isCatch ? 'Catch' : 'Categorise'}</td>
                        <td className="py-1 pr-3">
                          probe at {fmt(t.position)} ρmax on {t.directionDeg}° (level {t.level + 1}); endpoint {t.leftAnchor} on the left
                        </td>
                        <td className="py-1 pr-3">{t.correctKey ? `“${t.correctKey}”` : 'either (centre)'}</td>
                      </Fragment>
                    ) : (
                      <Fragment>
                        <td className="py-1 pr-3">Similarity</td>
                        <td className="py-1 pr-3">
                          {t.first} then {t.second}
                        </td>
                        <td className="py-1 pr-3">1–7</td>
                      </Fragment>
                    )}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </>
      ) : plan.isPending ? (
        <p className="text-sm text-graphite-muted">Building the plan…</p>
      ) : null}
    </section>
  );
}
