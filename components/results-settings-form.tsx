'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { ApiError, apiFetch } from '@/lib/api-client';
import type { ResultSettings } from '@/lib/schemas/study-results';
import { Button } from './ui/button';
import { Field } from './ui/field';
import { Notice } from './ui/notice';

const SELECT = 'mt-1 block h-9 w-full rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm text-graphite focus:border-accent';

/** How the results are computed: link, lapse, bootstrap and exclusion rules; saving recomputes the page. */
export function ResultsSettingsForm({ lab, studyId, settings, canEdit }: { lab: string; studyId: string; settings: ResultSettings; canEdit: boolean }) {
  const router = useRouter();
  const [v, setV] = useState({ ...settings, rtMadK: settings.rtMadK === null ? '' : String(settings.rtMadK) });
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const set = (patch: Partial<typeof v>) => setV((old) => ({ ...old, ...patch }));
  const num = (s: string | number) => (s === '' ? Number.NaN : Number(s));

  async function save(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setMessage(null);
    try {
      await apiFetch(`/api/v1/labs/${lab}/studies/${studyId}/results/settings`, {
        method: 'PUT',
        body: { ...v, lapseValue: num(v.lapseValue), resamples: num(v.resamples), seed: num(v.seed), alpha: num(v.alpha), catchAccuracyMin: num(v.catchAccuracyMin), rtMadK: v.rtMadK === '' ? null : num(v.rtMadK) },
      });
      setErrors({});
      router.refresh();
    } catch (error) {
      if (error instanceof ApiError) {
        setErrors(error.fields);
        setMessage(error.message);
      } else setMessage('The settings could not be saved.');
    } finally {
      setBusy(false);
    }
  }

  const err = (k: string) => errors[k]?.[0];
  return (
    <form onSubmit={save} className="space-y-4" data-testid="results-settings" aria-label="Analysis settings">
      <fieldset disabled={!canEdit || busy} className="grid gap-4 sm:grid-cols-2">
        <div>
          <label htmlFor="results-link" className="block text-sm font-medium">Psychometric function</label>
          <select id="results-link" className={SELECT} value={v.link} onChange={(e) => set({ link: e.target.value as ResultSettings['link'] })} data-testid="results-link">
            <option value="logit">Logistic (logit)</option>
            <option value="probit">Cumulative normal (probit)</option>
          </select>
        </div>
        <div>
          <label htmlFor="results-lapse-mode" className="block text-sm font-medium">Lapse rate λ</label>
          <select id="results-lapse-mode" className={SELECT} value={v.lapseMode} onChange={(e) => set({ lapseMode: e.target.value as ResultSettings['lapseMode'] })} data-testid="results-lapse-mode">
            <option value="free">Fitted, up to a maximum</option>
            <option value="fixed">Fixed</option>
          </select>
        </div>
        <Field label={v.lapseMode === 'free' ? 'Largest λ' : 'λ'} type="number" step="0.005" value={v.lapseValue} onChange={(e) => set({ lapseValue: e.target.value as unknown as number })} error={err('lapseValue')} data-testid="results-lapse-value" />
        <Field label="Bootstrap resamples" type="number" step="100" value={v.resamples} onChange={(e) => set({ resamples: e.target.value as unknown as number })} error={err('resamples')} hint="At least 1,000; the goodness of fit uses as many again." />
        <Field label="Seed" type="number" value={v.seed} onChange={(e) => set({ seed: e.target.value as unknown as number })} error={err('seed')} hint="Same data, settings and seed give the same intervals." />
        <Field label="Significance level α" type="number" step="0.01" value={v.alpha} onChange={(e) => set({ alpha: e.target.value as unknown as number })} error={err('alpha')} />
        <Field label="Lowest catch accuracy (0–1)" type="number" step="0.05" value={v.catchAccuracyMin} onChange={(e) => set({ catchAccuracyMin: e.target.value as unknown as number })} error={err('catchAccuracyMin')} hint="Participants below it are left out; 0 turns the rule off." data-testid="results-catch-min" />
        <Field label="RT outliers beyond k scaled MADs" type="number" step="0.5" value={v.rtMadK} onChange={(e) => set({ rtMadK: e.target.value })} error={err('rtMadK')} hint="Per participant, from their median RT; empty turns the rule off." data-testid="results-mad-k" />
      </fieldset>
      {message ? <Notice tone="error">{message}</Notice> : null}
      {canEdit ? (
        <Button type="submit" disabled={busy} data-testid="results-settings-save">
          {busy ? 'Saving…' : 'Save and recompute'}
        </Button>
      ) : (
        <p className="text-xs text-graphite-muted">Only an Owner or Experimenter can change the settings.</p>
      )}
    </form>
  );
}
