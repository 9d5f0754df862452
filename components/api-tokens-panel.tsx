'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { apiFetch } from '@/lib/api-client';
import { applyApiError } from '@/lib/form-errors';
import { API_TOKEN_SCOPES, API_TOKEN_SCOPE_LABELS, CreateApiTokenSchema, MAX_TOKEN_DAYS, type ApiTokenValue, type CreateApiTokenInput, type CreatedApiToken } from '@/lib/schemas/api-token';
import type { Page } from '@/lib/schemas/common';
import { Button } from './ui/button';
import { Field } from './ui/field';
import { Notice } from './ui/notice';

const STATE_TEXT: Record<ApiTokenValue['state'], string> = { active: 'Active', expired: 'Expired', revoked: 'Revoked' };
const day = (iso: string | null) => (iso ? new Date(iso).toISOString().slice(0, 10) : '—');

/** An Owner's API tokens: make one (shown once), see each one's scope, expiry and last use, revoke. */
export function ApiTokensPanel({ lab, initial }: { lab: string; initial: Page<ApiTokenValue> }) {
  const client = useQueryClient();
  const key = ['api-tokens', lab];
  const tokens = useQuery({ queryKey: key, queryFn: () => apiFetch<Page<ApiTokenValue>>(`/api/v1/labs/${lab}/api-tokens?limit=200`), initialData: initial });
  const [created, setCreated] = useState<CreatedApiToken | null>(null);
  const [copied, setCopied] = useState(false);
  const form = useForm<CreateApiTokenInput>({ resolver: zodResolver(CreateApiTokenSchema), defaultValues: { name: '', scope: 'read', expiresInDays: 90 } });
  const [formError, setFormError] = useState<string | null>(null);

  const create = useMutation({
    mutationFn: (values: CreateApiTokenInput) => apiFetch<CreatedApiToken>(`/api/v1/labs/${lab}/api-tokens`, { method: 'POST', body: values }),
    onSuccess: (t) => {
      setCreated(t);
      setCopied(false);
      setFormError(null);
      form.reset({ name: '', scope: 'read', expiresInDays: 90 });
      void client.invalidateQueries({ queryKey: key });
    },
    onError: (e) => setFormError(applyApiError<CreateApiTokenInput>(e, form.setError, ['name', 'scope', 'expiresInDays'])),
  });
  const revoke = useMutation({
    mutationFn: (id: string) => apiFetch<ApiTokenValue>(`/api/v1/labs/${lab}/api-tokens/${id}`, { method: 'DELETE' }),
    onSuccess: () => void client.invalidateQueries({ queryKey: key }),
  });

  const copy = async () => {
    if (!created) return;
    await navigator.clipboard?.writeText(created.token).catch(() => undefined);
    setCopied(true);
  };

  return (
    <div className="max-w-4xl space-y-8">
      <form onSubmit={form.handleSubmit((v) => create.mutate(v))} className="space-y-4 border-[0.5px] border-rule p-4" aria-labelledby="new-token-heading" data-testid="token-form" noValidate>
        <h2 id="new-token-heading" className="text-base font-semibold">
          Make a token
        </h2>
        <div className="grid gap-4 sm:grid-cols-3">
          <Field label="Name" hint="The script or computer that will use it" error={form.formState.errors.name?.message} data-testid="token-name" {...form.register('name')} />
          <div>
            <label htmlFor="token-scope" className="block text-sm font-medium text-graphite">
              Scope
            </label>
            <select id="token-scope" {...form.register('scope')} className="mt-1 block h-9 w-full rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm" data-testid="token-scope">
              {API_TOKEN_SCOPES.map((s) => (
                <option key={s} value={s}>
                  {API_TOKEN_SCOPE_LABELS[s]}
                </option>
              ))}
            </select>
          </div>
          <Field
            label="Expires after (days)"
            type="number"
            min={1}
            max={MAX_TOKEN_DAYS}
            hint={`1 to ${MAX_TOKEN_DAYS} days`}
            error={form.formState.errors.expiresInDays?.message}
            data-testid="token-days"
            {...form.register('expiresInDays', { valueAsNumber: true })}
          />
        </div>
        <p className="text-xs text-graphite-muted">A read token acts as a Reviewer; a write token as an Experimenter (it can also make pack jobs and run orders). Neither can do more than you can.</p>
        {formError ? <Notice tone="error">{formError}</Notice> : null}
        <Button type="submit" disabled={create.isPending} data-testid="token-create">
          {create.isPending ? 'Making…' : 'Make token'}
        </Button>
      </form>

      {created ? (
        <Notice tone="caution" testId="token-created">
          <p className="font-medium">Copy “{created.name}” now: it is shown only this once.</p>
          <p className="mt-2 break-all font-mono text-xs" data-testid="token-secret">
            {created.token}
          </p>
          <div className="mt-2 flex items-center gap-3">
            <Button type="button" variant="quiet" onClick={copy} data-testid="token-copy">
              Copy
            </Button>
            <span role="status" className="text-xs">
              {copied ? 'Copied.' : ''}
            </span>
          </div>
          <p className="mt-2 text-xs">Send it as the header Authorization: Bearer followed by the token. Epicycle keeps only its SHA-256.</p>
        </Notice>
      ) : null}

      <section aria-labelledby="tokens-heading">
        <h2 id="tokens-heading" className="mb-2 text-base font-semibold">
          Tokens of this lab
        </h2>
        {tokens.data.items.length === 0 ? (
          <p className="text-sm text-graphite-soft">No tokens yet.</p>
        ) : (
          <table className="w-full border-collapse text-sm" data-testid="tokens-table">
            <thead>
              <tr className="border-b-[0.5px] border-rule-strong text-left text-graphite-soft">
                {['Name', 'Starts with', 'Scope', 'Made by', 'Expires', 'Last used', 'State', ''].map((h) => (
                  <th key={h} scope="col" className="py-2 pr-3 font-medium">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {tokens.data.items.map((t) => (
                <tr key={t.id} className="border-b-[0.5px] border-rule" data-testid={`token-row-${t.name}`} data-state={t.state}>
                  <td className="py-2 pr-3">{t.name}</td>
                  <td className="py-2 pr-3 font-mono text-xs">{t.prefix}…</td>
                  <td className="py-2 pr-3">{t.scope}</td>
                  <td className="py-2 pr-3">{t.createdBy ?? '—'}</td>
                  <td className="tabular py-2 pr-3">{day(t.expiresAt)}</td>
                  <td className="tabular py-2 pr-3">{day(t.lastUsedAt)}</td>
                  <td className="py-2 pr-3">{STATE_TEXT[t.state]}</td>
                  <td className="py-2 text-right">
                    {t.state === 'active' ? (
                      <Button type="button" variant="danger" size="sm" onClick={() => revoke.mutate(t.id)} disabled={revoke.isPending} data-testid={`token-revoke-${t.name}`} aria-label={`Revoke ${t.name}`}>
                        Revoke
                      </Button>
                    ) : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
        {revoke.isError ? <Notice tone="error">{revoke.error.message}</Notice> : null}
      </section>
    </div>
  );
}
