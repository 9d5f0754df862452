import type { Metadata } from 'next';
import Link from 'next/link';
import { ApiTokensPanel } from '@/components/api-tokens-panel';
import { Notice } from '@/components/ui/notice';
import { can } from '@/lib/server/policy';
import { requireLabPageActor } from '@/lib/server/page-context';
import { getDb } from '@/lib/server/db';
import { listApiTokens } from '@/lib/server/services/api-tokens';

export const metadata: Metadata = { title: 'API tokens' };

export default async function ApiTokensPage({ params }: { params: Promise<{ lab: string }> }) {
  const { lab } = await params;
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/settings/api-tokens`);
  const isOwner = can(actor.role, 'tokens:manage');
  return (
    <>
      <h1 className="mb-2 text-2xl font-semibold">Lab settings · API tokens</h1>
      <p className="mb-6 max-w-3xl text-sm text-graphite-soft">
        Tokens let the lab&apos;s scripts fetch approved editions and packs and, with write scope, make pack jobs, without anyone&apos;s password. The{' '}
        <Link href={`/labs/${lab}/api`} className="text-accent underline underline-offset-2">
          API page
        </Link>{' '}
        has examples.
      </p>
      {isOwner ? (
        <ApiTokensPanel lab={actor.labSlug} initial={await listApiTokens(getDb(), actor, { limit: 200 })} />
      ) : (
        <Notice tone="info" testId="tokens-owner-only">
          Only the lab&apos;s Owners make and revoke API tokens. Ask one of them for a token for your script.
        </Notice>
      )}
    </>
  );
}
