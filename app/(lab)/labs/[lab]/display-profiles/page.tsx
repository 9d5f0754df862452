import type { Metadata } from 'next';
import { DisplayProfileManager } from '@/components/display-profile-manager';
import { getDb } from '@/lib/server/db';
import { requireLabPageActor } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { listDisplayProfiles } from '@/lib/server/services/display-profiles';

export const metadata: Metadata = { title: 'Display profiles' };

export default async function DisplayProfilesPage({ params }: { params: Promise<{ lab: string }> }) {
  const { lab } = await params;
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/display-profiles`);
  const profiles = await listDisplayProfiles(getDb(), actor, { limit: 200 });
  return (
    <>
      <h1 className="mb-2 text-2xl font-semibold">Display profiles</h1>
      <p className="mb-6 max-w-2xl text-sm text-graphite-soft">
        A display profile describes one screen and where the participant sits. Packs are drawn for a profile, so a stimulus of 4° is 4° on that screen.
      </p>
      <DisplayProfileManager lab={lab} profiles={profiles.items} canEdit={can(actor.role, 'profile:write')} />
    </>
  );
}
