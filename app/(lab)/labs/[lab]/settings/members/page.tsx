import type { Metadata } from 'next';
import { MembersPanel } from '@/components/members-panel';
import { can } from '@/lib/server/policy';
import { requireLabPageActor } from '@/lib/server/page-context';

export const metadata: Metadata = { title: 'Members' };

export default async function MembersPage({ params }: { params: Promise<{ lab: string }> }) {
  const { lab } = await params;
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/settings/members`);
  return (
    <>
      <h1 className="mb-6 text-2xl font-semibold">Lab settings · Members</h1>
      <MembersPanel lab={actor.labSlug} canManage={can(actor.role, 'members:manage')} currentUserId={actor.userId} />
    </>
  );
}
