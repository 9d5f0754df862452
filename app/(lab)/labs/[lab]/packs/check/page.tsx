import type { Metadata } from 'next';
import { PackCheckForm } from '@/components/pack-check-form';
import { requireLabPageActor } from '@/lib/server/page-context';

export const metadata: Metadata = { title: 'Check a pack' };

export default async function CheckPackPage({ params }: { params: Promise<{ lab: string }> }) {
  const { lab } = await params;
  await requireLabPageActor(lab, `/labs/${lab}/packs/check`);
  return (
    <>
      <h1 className="mb-2 text-2xl font-semibold">Check a pack</h1>
      <p className="mb-6 max-w-2xl text-sm text-graphite-soft">
        Upload a stimulus pack, or just its manifest.json with its SHA256SUMS, to see whether any file was changed, lost or added since the pack was
        made, and whether it comes from an edition of this lab. Nothing you upload is stored.
      </p>
      <PackCheckForm lab={lab} />
    </>
  );
}
