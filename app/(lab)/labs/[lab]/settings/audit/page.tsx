import type { Metadata } from 'next';
import Link from 'next/link';
import { getDb } from '@/lib/server/db';
import { requireLabPageActor } from '@/lib/server/page-context';
import { listAuditEvents } from '@/lib/server/services/audit';

export const metadata: Metadata = { title: 'Audit log' };

const PAGE_SIZE = 100;

/** Every change in the lab, newest first: who did what, to what, and when. */
export default async function AuditPage({ params, searchParams }: { params: Promise<{ lab: string }>; searchParams: Promise<{ cursor?: string }> }) {
  const { lab } = await params;
  const { cursor } = await searchParams;
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/settings/audit`);
  const page = await listAuditEvents(getDb(), actor, { limit: PAGE_SIZE, ...(cursor && /^[A-Za-z0-9_-]{1,200}$/.test(cursor) ? { cursor } : {}) });
  return (
    <>
      <h1 className="mb-6 text-2xl font-semibold">Lab settings · Audit log</h1>
      {page.items.length === 0 ? <p className="text-graphite-muted">Nothing recorded yet.</p> : null}
      <table className="w-full border-collapse text-sm" data-testid="audit-table">
        <thead>
          <tr className="border-b-[0.5px] border-rule-strong text-left text-graphite-soft">
            <th scope="col" className="py-2 pr-4 font-medium">When (UTC)</th>
            <th scope="col" className="py-2 pr-4 font-medium">Who</th>
            <th scope="col" className="py-2 pr-4 font-medium">What</th>
            <th scope="col" className="py-2 pr-4 font-medium">Details</th>
          </tr>
        </thead>
        <tbody>
          {page.items.map((e) => (
            <tr key={e.id} className="border-b-[0.5px] border-rule align-top">
              <td className="tabular py-1.5 pr-4 text-xs">{e.at.slice(0, 19).replace('T', ' ')}</td>
              <td className="py-1.5 pr-4">{e.actor ?? '—'}</td>
              <td className="tabular py-1.5 pr-4 text-xs">{e.action}</td>
              <td className="tabular py-1.5 pr-4 text-xs text-graphite-soft">{JSON.stringify(e.details)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {page.nextCursor ? (
        <Link href={`/labs/${lab}/settings/audit?cursor=${page.nextCursor}`} className="mt-4 inline-block text-sm text-accent underline underline-offset-2">
          Older events
        </Link>
      ) : null}
    </>
  );
}
