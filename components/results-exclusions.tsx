'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { ApiError, apiFetch } from '@/lib/api-client';
import type { ManualExclusionValue, ReportExclusionValue } from '@/lib/schemas/study-results';
import { Button } from './ui/button';
import { Field } from './ui/field';
import { Notice } from './ui/notice';

const RULE_LABELS: Record<ReportExclusionValue['rule'], string> = { 'catch-accuracy': 'Catch accuracy', 'rt-outlier': 'RT outlier', manual: 'Manual' };
const SELECT = 'mt-1 block h-9 w-full rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm text-graphite focus:border-accent';
const when = (iso: string) => iso.slice(0, 16).replace('T', ' ');

/**
 * What was left out of the fits and why, the record of manual decisions, and (for those who may) a form to exclude
 * a session or a trial, or to keep one that a rule left out.
 */
export function ResultsExclusions({
  lab,
  studyId,
  exclusions,
  manual,
  sessions,
  canEdit,
}: {
  lab: string;
  studyId: string;
  exclusions: readonly ReportExclusionValue[];
  manual: readonly ManualExclusionValue[];
  sessions: readonly { id: string; participant: number }[];
  canEdit: boolean;
}) {
  const router = useRouter();
  const base = `/api/v1/labs/${lab}/studies/${studyId}/results/exclusions`;
  const [form, setForm] = useState({ sessionId: sessions[0]?.id ?? '', trialIndex: '', action: 'exclude' as 'exclude' | 'keep', reason: '' });
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function run(call: () => Promise<unknown>) {
    setBusy(true);
    setMessage(null);
    try {
      await call();
      setErrors({});
      setForm((f) => ({ ...f, trialIndex: '', reason: '' }));
      router.refresh();
    } catch (error) {
      if (error instanceof ApiError) {
        setErrors(error.fields);
        setMessage(error.message);
      } else setMessage('That did not work; try again.');
    } finally {
      setBusy(false);
    }
  }
  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    void run(() => apiFetch(base, { method: 'POST', body: { sessionId: form.sessionId, trialIndex: form.trialIndex === '' ? null : Number(form.trialIndex), action: form.action, reason: form.reason } }));
  };
  const keep = (e: ReportExclusionValue) => {
    if (!e.sessionId) return;
    setForm({ sessionId: e.sessionId, trialIndex: e.trialIndex === null ? '' : String(e.trialIndex), action: 'keep', reason: '' });
    document.getElementById('exclusion-reason')?.focus();
  };

  return (
    <div className="space-y-6">
      {exclusions.length === 0 ? (
        <p className="text-sm text-graphite-soft" data-testid="exclusions-none">Nothing was excluded.</p>
      ) : (
        <table className="w-full text-sm" data-testid="exclusions-table">
          <caption className="sr-only">Exclusions</caption>
          <thead>
            <tr className="border-b-[0.5px] border-rule-strong text-left text-xs text-graphite-soft">
              <th scope="col" className="py-1.5 pr-3 font-medium">Participant</th>
              <th scope="col" className="py-1.5 pr-3 font-medium">Trial</th>
              <th scope="col" className="py-1.5 pr-3 font-medium">Rule</th>
              <th scope="col" className="py-1.5 pr-3 font-medium">Reason</th>
              <th scope="col" className="py-1.5 font-medium"><span className="sr-only">Actions</span></th>
            </tr>
          </thead>
          <tbody>
            {exclusions.map((e) => (
              <tr key={`${e.rule}:${e.participant}:${e.trialIndex ?? '*'}:${e.manualId ?? ''}`} className="border-b-[0.5px] border-rule align-top" data-testid="exclusion-row">
                <td className="tabular py-1.5 pr-3">{e.participant}</td>
                <td className="tabular py-1.5 pr-3">{e.trialIndex === null ? 'all' : e.trialIndex}</td>
                <td className="py-1.5 pr-3">{RULE_LABELS[e.rule]}</td>
                <td className="py-1.5 pr-3">
                  {e.reason}
                  {e.isOverridden ? <span className="ml-1 text-xs text-caution">(kept by a manual decision)</span> : null}
                </td>
                <td className="py-1.5 text-right">
                  {canEdit && e.rule !== 'manual' && !e.isOverridden && e.sessionId ? (
                    <Button size="sm" variant="quiet" onClick={() => keep(e)} data-testid="exclusion-keep">Keep…</Button>
                  ) : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}

      <div>
        <h3 className="mb-2 text-sm font-semibold">Manual decisions (the record)</h3>
        {manual.length === 0 ? (
          <p className="text-sm text-graphite-soft">None yet. Sessions excluded in the monitor are left out as well.</p>
        ) : (
          <ul className="space-y-1 text-sm" data-testid="manual-decisions">
            {manual.map((m) => (
              <li key={m.id} className={`flex flex-wrap items-center gap-2 ${m.removedAt ? 'text-graphite-muted line-through' : ''}`} data-testid="manual-decision">
                <span className="tabular">
                  {m.action === 'exclude' ? 'Exclude' : 'Keep'} participant {m.participant}
                  {m.trialIndex === null ? '' : `, trial ${m.trialIndex}`}
                </span>
                <span>— {m.reason}</span>
                <span className="tabular text-xs text-graphite-soft">
                  {m.createdBy ?? 'someone'}, {when(m.createdAt)}
                  {m.removedAt ? `; removed by ${m.removedBy ?? 'someone'}, ${when(m.removedAt)}` : ''}
                </span>
                {canEdit && !m.removedAt ? (
                  <Button size="sm" variant="danger" disabled={busy} onClick={() => void run(() => apiFetch(`${base}/${m.id}`, { method: 'DELETE' }))} data-testid="manual-remove">Remove</Button>
                ) : null}
              </li>
            ))}
          </ul>
        )}
      </div>

      {canEdit && sessions.length > 0 ? (
        <form onSubmit={submit} className="grid gap-3 border-t-[0.5px] border-rule pt-4 sm:grid-cols-3 sm:items-end" data-testid="exclusion-form" aria-label="Add a manual decision">
          <div>
            <label htmlFor="exclusion-session" className="block text-sm font-medium">Participant</label>
            <select id="exclusion-session" className={SELECT} value={form.sessionId} onChange={(e) => setForm({ ...form, sessionId: e.target.value })} data-testid="exclusion-session">
              {sessions.map((s) => (
                <option key={s.id} value={s.id}>{s.participant}</option>
              ))}
            </select>
          </div>
          <Field label="Trial (empty: all)" type="number" min={0} value={form.trialIndex} onChange={(e) => setForm({ ...form, trialIndex: e.target.value })} error={errors.trialIndex?.[0]} data-testid="exclusion-trial" />
          <div>
            <label htmlFor="exclusion-action" className="block text-sm font-medium">Decision</label>
            <select id="exclusion-action" className={SELECT} value={form.action} onChange={(e) => setForm({ ...form, action: e.target.value as 'exclude' | 'keep' })} data-testid="exclusion-action">
              <option value="exclude">Exclude</option>
              <option value="keep">Keep (override a rule)</option>
            </select>
          </div>
          <Field id="exclusion-reason" className="sm:col-span-2" label="Reason" value={form.reason} onChange={(e) => setForm({ ...form, reason: e.target.value })} error={errors.reason?.[0]} data-testid="exclusion-reason" />
          <Button type="submit" disabled={busy} data-testid="exclusion-save">Record</Button>
        </form>
      ) : null}
      {message ? <Notice tone="error">{message}</Notice> : null}
    </div>
  );
}
