'use client';

import { useState } from 'react';

/** Withdrawal after a session, by the session code shown at its end: the answers are deleted. */
export function WithdrawForm() {
  const [code, setCode] = useState('');
  const [state, setState] = useState<{ kind: 'idle' | 'done' | 'error'; message?: string }>({ kind: 'idle' });
  const submit = async () => {
    const res = await fetch('/api/v1/withdrawals', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ sessionCode: code }) });
    const body = (await res.json().catch(() => ({}))) as { deletedTrials?: number; detail?: string; errors?: Record<string, string[]> };
    if (res.ok) setState({ kind: 'done', message: `Your session is withdrawn: ${body.deletedTrials ?? 0} answers were deleted.` });
    else setState({ kind: 'error', message: body.errors?.sessionCode?.[0] ?? body.detail ?? 'The withdrawal did not go through; please try again.' });
  };
  if (state.kind === 'done') return <p role="status" data-testid="withdraw-done">{state.message}</p>;
  return (
    <form
      className="space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
    >
      <label className="block">
        <span className="block text-sm">Session code</span>
        <input value={code} onChange={(e) => setCode(e.target.value)} placeholder="ABCDE-FGHIJ-KLMNO-PQRST" className="w-80 border border-rule-strong px-2 py-1 font-mono" data-testid="withdraw-code" aria-describedby={state.kind === 'error' ? 'withdraw-error' : undefined} />
      </label>
      {state.kind === 'error' ? <p id="withdraw-error" role="alert" className="text-danger">{state.message}</p> : null}
      <button type="submit" className="rounded bg-accent px-4 py-2 text-white" data-testid="withdraw-submit">Withdraw and delete my answers</button>
    </form>
  );
}
