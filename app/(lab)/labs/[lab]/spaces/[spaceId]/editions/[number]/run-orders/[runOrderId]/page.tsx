import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { RefreshWhile } from '@/components/refresh-while';
import { RunOrderActions } from '@/components/run-order-actions';
import { RunOrderForm } from '@/components/run-order-form';
import { RunOrderSummary } from '@/components/run-order-summary';
import { Notice } from '@/components/ui/notice';
import { AppError } from '@/lib/errors';
import { RUN_ORDER_SELECTION_LABELS, RUN_ORDER_STATE_LABELS, SEQUENCE_KIND_LABELS } from '@/lib/schemas/run-order';
import { getDb } from '@/lib/server/db';
import { requireLabPageActor } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { getEditionSnapshot } from '@/lib/server/services/editions';
import { getRunOrder } from '@/lib/server/services/run-orders';

export const metadata: Metadata = { title: 'Run order' };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export default async function RunOrderPage({ params }: { params: Promise<{ lab: string; spaceId: string; number: string; runOrderId: string }> }) {
  const { lab, spaceId, number: raw, runOrderId } = await params;
  const number = Number(raw);
  if (!UUID.test(spaceId) || !UUID.test(runOrderId) || !Number.isInteger(number) || number < 1) notFound();
  const base = `/labs/${lab}/spaces/${spaceId}/editions/${number}`;
  const { actor } = await requireLabPageActor(lab, `${base}/run-orders/${runOrderId}`);
  const db = getDb();
  const [order, snapshot] = await Promise.all([getRunOrder(db, actor, runOrderId), getEditionSnapshot(db, actor, spaceId, number)]).catch((e: unknown) => {
    if (e instanceof AppError && e.kind === 'not_found') notFound();
    throw e;
  });
  if (order.edition.spaceId !== spaceId || order.edition.number !== number) notFound();
  const d = order.definition;
  const iti = d.timing.iti;
  const itiText = iti.kind === 'fixed' ? `${iti.duration} s fixed` : iti.kind === 'uniform' ? `uniform ${iti.min}–${iti.max} s` : `truncated exponential, mean ${iti.mean} s, ${iti.min}–${iti.max} s`;
  const canWrite = can(actor.role, 'runorder:write');
  return (
    <>
      <p className="mb-4 text-sm text-graphite-muted">
        <Link href={`/labs/${lab}/spaces/${spaceId}`} className="text-accent underline underline-offset-2">
          {order.edition.spaceName}
        </Link>{' '}
        /{' '}
        <Link href={base} className="text-accent underline underline-offset-2">
          Edition {number}
        </Link>{' '}
        /{' '}
        <Link href={`${base}/run-orders`} className="text-accent underline underline-offset-2">
          Run orders
        </Link>{' '}
        / {order.name}
      </p>
      <h1 className="mb-1 text-2xl font-semibold" data-testid="run-order-title">
        {order.name}
      </h1>
      <p className="mb-4 text-sm text-graphite-soft" data-testid="run-order-state">
        {RUN_ORDER_STATE_LABELS[order.state]} · {SEQUENCE_KIND_LABELS[d.sequence.kind]} · {RUN_ORDER_SELECTION_LABELS[d.conditions.selection]}
        {d.conditions.nullEvents ? ' with null events' : ''} · trials {d.timing.trialDuration} s, ITI {itiText}, TR {d.timing.tr} s, {d.timing.dummyVolumes} dummy volumes
        {d.timing.dummyVolumes > 0 ? (d.timing.dummyVolumesStored ? ' (stored)' : ' (not stored)') : ''} · {d.runs} run{d.runs === 1 ? '' : 's'}
        {d.runMode === 'cut' ? ' cut from one sequence' : ''} · seed <span className="tabular">{d.seed}</span>
      </p>
      <div className="mb-6">
        <RunOrderActions lab={lab} id={order.id} isReady={order.state === 'ready'} canDelete={canWrite} backHref={`${base}/run-orders`} />
      </div>
      {order.state === 'queued' || order.state === 'running' ? (
        <Notice tone="info" testId="run-order-searching">
          The type-1 index-1 sequence is being searched for in the background; this page updates when it is found or the time runs out.
          <RefreshWhile active />
        </Notice>
      ) : null}
      {order.state === 'failed' ? (
        <Notice tone="error" testId="run-order-failed">
          {order.error}
        </Notice>
      ) : null}
      {order.result ? <RunOrderSummary result={order.result} tr={d.timing.tr} /> : null}
      {canWrite ? (
        <details className="mt-10 max-w-4xl border-[0.5px] border-rule p-4">
          <summary className="cursor-pointer text-sm font-medium" data-testid="edit-run-order">
            Change this run order
          </summary>
          <div className="mt-4">
            <RunOrderForm lab={lab} spaceId={spaceId} number={number} layout={snapshot.definition.layout} stimulusIds={snapshot.stimuli.map((s) => s.id)} existing={order} defaults={d} />
          </div>
        </details>
      ) : null}
    </>
  );
}
