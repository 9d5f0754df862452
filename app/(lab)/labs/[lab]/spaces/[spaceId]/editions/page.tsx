import type { Metadata } from 'next';
import Link from 'next/link';
import { EditionStateBadge } from '@/components/edition-state-badge';
import { shortHash } from '@/lib/edition-view';
import { getDb } from '@/lib/server/db';
import { orNotFound, requireLabPageActor, requireUuidSegment } from '@/lib/server/page-context';
import { listEditions } from '@/lib/server/services/editions';
import { getShapeSpace } from '@/lib/server/services/shape-spaces';

export const metadata: Metadata = { title: 'Editions' };

export default async function EditionsPage({ params }: { params: Promise<{ lab: string; spaceId: string }> }) {
  const { lab, spaceId } = await params;
  requireUuidSegment(spaceId);
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/spaces/${spaceId}/editions`);
  const space = await orNotFound(getShapeSpace(getDb(), actor, spaceId));
  const editions = (await listEditions(getDb(), actor, spaceId, { limit: 200 })).items;
  return (
    <>
      <p className="mb-4 text-sm text-graphite-muted">
        <Link href={`/labs/${lab}/spaces`} className="text-accent underline underline-offset-2">
          Shape spaces
        </Link>{' '}
        /{' '}
        <Link href={`/labs/${lab}/spaces/${spaceId}`} className="text-accent underline underline-offset-2">
          {space.name}
        </Link>{' '}
        / Editions
      </p>
      <h1 className="mb-2 text-2xl font-semibold">Editions of {space.name}</h1>
      <p className="mb-6 max-w-2xl text-sm text-graphite-soft">
        Each edition is a frozen, numbered snapshot with a SHA-256 content hash. It moves from Draft to In review, then to Approved or Returned; its content never changes.
      </p>
      {editions.length === 0 ? (
        <p className="text-graphite-muted">No editions yet. Freeze one from the space view.</p>
      ) : (
        <>
          <table className="w-full border-collapse text-sm" data-testid="edition-table">
            <thead>
              <tr className="border-b-[0.5px] border-rule-strong text-left text-graphite-soft">
                <th scope="col" className="py-2 pr-4 font-medium">Edition</th>
                <th scope="col" className="py-2 pr-4 font-medium">State</th>
                <th scope="col" className="py-2 pr-4 font-medium">Content hash</th>
                <th scope="col" className="py-2 pr-4 font-medium">Stimuli</th>
                <th scope="col" className="py-2 pr-4 font-medium">Frozen</th>
                <th scope="col" className="py-2 pr-4 font-medium">Decision</th>
                <th scope="col" className="py-2 pr-4 font-medium">Open comments</th>
              </tr>
            </thead>
            <tbody>
              {editions.map((e) => (
                <tr key={e.id} className="border-b-[0.5px] border-rule">
                  <td className="py-2 pr-4">
                    <Link href={`/labs/${lab}/spaces/${spaceId}/editions/${e.number}`} className="text-accent underline underline-offset-2" data-testid={`edition-link-${e.number}`}>
                      Edition {e.number}
                    </Link>
                    {e.changeNote ? <span className="block max-w-xs truncate text-xs text-graphite-muted">{e.changeNote}</span> : null}
                  </td>
                  <td className="py-2 pr-4">
                    <EditionStateBadge state={e.state} testId={`edition-state-${e.number}`} />
                    {e.supersededBy ? <span className="ml-2 text-xs text-graphite-muted">superseded by {e.supersededBy}</span> : null}
                  </td>
                  <td className="tabular py-2 pr-4 text-xs" title={e.contentHash}>
                    {shortHash(e.contentHash)}…
                  </td>
                  <td className="tabular py-2 pr-4">{e.stimulusCount}</td>
                  <td className="tabular py-2 pr-4 text-xs">
                    {e.createdAt.slice(0, 16).replace('T', ' ')} · {e.author?.name ?? '—'}
                  </td>
                  <td className="tabular py-2 pr-4 text-xs">{e.decidedAt ? `${e.decidedAt.slice(0, 16).replace('T', ' ')} · ${e.decidedBy?.name ?? '—'}` : '—'}</td>
                  <td className="tabular py-2 pr-4">{e.openComments}</td>
                </tr>
              ))}
            </tbody>
          </table>
          {editions.length > 1 ? (
            <form action={`/labs/${lab}/spaces/${spaceId}/editions/diff`} className="mt-6 flex flex-wrap items-end gap-3 text-sm" data-testid="compare-form">
              <label className="font-medium">
                Compare edition
                <select name="from" defaultValue={editions[1]!.number} className="mt-1 block h-8 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 font-normal" data-testid="compare-from">
                  {editions.map((e) => (
                    <option key={e.number} value={e.number}>
                      {e.number}
                    </option>
                  ))}
                </select>
              </label>
              <label className="font-medium">
                with edition
                <select name="to" defaultValue={editions[0]!.number} className="mt-1 block h-8 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 font-normal" data-testid="compare-to">
                  {editions.map((e) => (
                    <option key={e.number} value={e.number}>
                      {e.number}
                    </option>
                  ))}
                </select>
              </label>
              <button type="submit" className="h-9 rounded-[3px] border-[0.5px] border-rule-strong px-4 font-medium hover:bg-paper-deep" data-testid="compare-submit">
                Show the differences
              </button>
            </form>
          ) : null}
        </>
      )}
    </>
  );
}
