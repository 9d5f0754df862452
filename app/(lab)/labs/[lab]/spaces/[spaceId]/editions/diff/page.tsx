import type { Metadata } from 'next';
import Link from 'next/link';
import { EditionDiffView } from '@/components/edition-diff-view';
import { Notice } from '@/components/ui/notice';
import { AppError } from '@/lib/errors';
import { getDb } from '@/lib/server/db';
import { requireLabPageActor, requireUuidSegment } from '@/lib/server/page-context';
import { DiffQuerySchema } from '@/lib/schemas/edition';
import { diffEditionsOf } from '@/lib/server/services/editions';

export const metadata: Metadata = { title: 'Edition differences' };

export default async function EditionDiffPage({ params, searchParams }: { params: Promise<{ lab: string; spaceId: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { lab, spaceId } = await params;
  requireUuidSegment(spaceId);
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/spaces/${spaceId}/editions`);
  const query = DiffQuerySchema.safeParse(await searchParams);
  const crumbs = (
    <p className="mb-4 text-sm text-graphite-muted">
      <Link href={`/labs/${lab}/spaces/${spaceId}`} className="text-accent underline underline-offset-2">
        Shape space
      </Link>{' '}
      /{' '}
      <Link href={`/labs/${lab}/spaces/${spaceId}/editions`} className="text-accent underline underline-offset-2">
        Editions
      </Link>{' '}
      / Differences
    </p>
  );
  if (!query.success) {
    return (
      <>
        {crumbs}
        <Notice tone="error">Choose two editions to compare (from and to).</Notice>
      </>
    );
  }
  const diff = await diffEditionsOf(getDb(), actor, spaceId, query.data.from, query.data.to).catch((e: unknown) => {
    if (e instanceof AppError && e.kind === 'not_found') return e;
    throw e;
  });
  return (
    <>
      {crumbs}
      <h1 className="mb-4 text-2xl font-semibold">
        Edition {query.data.from} → edition {query.data.to}
      </h1>
      {diff instanceof AppError ? <Notice tone="error">{diff.message}</Notice> : <EditionDiffView diff={diff} />}
    </>
  );
}
