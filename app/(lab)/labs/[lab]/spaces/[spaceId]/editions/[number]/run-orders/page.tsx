import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { RunOrderForm } from '@/components/run-order-form';
import { AppError } from '@/lib/errors';
import { DEFAULT_RUN_ORDER_DEFINITION, RUN_ORDER_STATE_LABELS, SEQUENCE_KIND_LABELS } from '@/lib/schemas/run-order';
import { getDb } from '@/lib/server/db';
import { requireLabPageActor } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { getEdition, getEditionSnapshot } from '@/lib/server/services/editions';
import { listRunOrders } from '@/lib/server/services/run-orders';

export const metadata: Metadata = { title: 'Run orders' };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export default async function RunOrdersPage({ params }: { params: Promise<{ lab: string; spaceId: string; number: string }> }) {
  const { lab, spaceId, number: raw } = await params;
  const number = Number(raw);
  if (!UUID.test(spaceId) || !Number.isInteger(number) || number < 1) notFound();
  const base = `/labs/${lab}/spaces/${spaceId}/editions/${number}`;
  const { actor } = await requireLabPageActor(lab, `${base}/run-orders`);
  const db = getDb();
  const [edition, snapshot, orders] = await Promise.all([getEdition(db, actor, spaceId, number), getEditionSnapshot(db, actor, spaceId, number), listRunOrders(db, actor, spaceId, number, { limit: 100 })]).catch((e: unknown) => {
    if (e instanceof AppError && e.kind === 'not_found') notFound();
    throw e;
  });
  const canWrite = can(actor.role, 'runorder:write');
  return (
    <>
      <p className="mb-4 text-sm text-graphite-muted">
        <Link href={`/labs/${lab}/spaces/${spaceId}`} className="text-accent underline underline-offset-2">
          {edition.spaceName}
        </Link>{' '}
        /{' '}
        <Link href={base} className="text-accent underline underline-offset-2">
          Edition {number}
        </Link>{' '}
        / Run orders
      </p>
      <h1 className="mb-2 text-2xl font-semibold">Run orders</h1>
      <p className="mb-6 max-w-2xl text-sm text-graphite-soft">
        Trial orders for a scanning or EEG session, in which every stimulus follows every other equally often, with timing in seconds. Each run becomes a BIDS <code>events.tsv</code> file with its
        sidecar.
      </p>
      <section aria-labelledby="run-order-list-heading" className="mb-10">
        <h2 id="run-order-list-heading" className="mb-2 text-base font-semibold">
          This edition’s run orders
        </h2>
        {orders.items.length === 0 ? (
          <p className="text-sm text-graphite-soft" data-testid="no-run-orders">
            None yet.
          </p>
        ) : (
          <table className="tabular w-full max-w-4xl text-left text-sm" data-testid="run-order-list">
            <thead>
              <tr className="border-b-[0.5px] border-rule">
                <th scope="col" className="py-1.5 pr-4 font-medium">Name</th>
                <th scope="col" className="py-1.5 pr-4 font-medium">Sequence</th>
                <th scope="col" className="py-1.5 pr-4 font-medium">Runs</th>
                <th scope="col" className="py-1.5 pr-4 font-medium">Trials</th>
                <th scope="col" className="py-1.5 pr-4 font-medium">State</th>
              </tr>
            </thead>
            <tbody>
              {orders.items.map((o) => (
                <tr key={o.id} className="border-b-[0.5px] border-rule">
                  <td className="py-1.5 pr-4">
                    <Link href={`${base}/run-orders/${o.id}`} className="text-accent underline underline-offset-2" data-testid="run-order-link">
                      {o.name}
                    </Link>
                  </td>
                  <td className="py-1.5 pr-4">{SEQUENCE_KIND_LABELS[o.definition.sequence.kind].split(' (')[0]}</td>
                  <td className="py-1.5 pr-4">{o.definition.runs}</td>
                  <td className="py-1.5 pr-4">{o.result?.summary.trials ?? '—'}</td>
                  <td className="py-1.5 pr-4">{RUN_ORDER_STATE_LABELS[o.state]}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
      {canWrite ? (
        <div className="max-w-4xl border-[0.5px] border-rule p-4">
          <RunOrderForm lab={lab} spaceId={spaceId} number={number} layout={snapshot.definition.layout} stimulusIds={snapshot.stimuli.map((s) => s.id)} defaults={DEFAULT_RUN_ORDER_DEFINITION} />
        </div>
      ) : (
        <p className="text-sm text-graphite-soft">Experimenters and the Owner make run orders; you can read and download them.</p>
      )}
    </>
  );
}
