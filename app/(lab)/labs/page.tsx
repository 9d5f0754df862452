import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { SiteHeader } from '@/components/site-header';
import { ROLE_LABELS } from '@/lib/schemas/roles';
import { getDb } from '@/lib/server/db';
import { requirePageUser } from '@/lib/server/page-context';
import { listMyLabs } from '@/lib/server/services/labs';

export const metadata: Metadata = { title: 'Your labs' };

export default async function LabsPage() {
  const user = await requirePageUser('/labs');
  const labs = await listMyLabs(getDb(), user.id);
  if (labs.length === 1) redirect(`/labs/${labs[0]!.slug}`);
  return (
    <>
      <SiteHeader />
      <main id="main" className="mx-auto max-w-page px-6 py-12">
        <h1 className="text-2xl font-semibold">Your labs</h1>
        {labs.length === 0 ? (
          <p className="mt-4 text-graphite-soft">You are not in a lab yet. Ask an Owner for an invitation.</p>
        ) : (
          <ul className="mt-6 divide-y-[0.5px] divide-rule border-y-[0.5px] border-rule">
            {labs.map((l) => (
              <li key={l.slug} className="flex items-center justify-between py-3">
                <Link href={`/labs/${l.slug}`} className="text-accent hover:underline">
                  {l.name}
                </Link>
                <span className="tabular text-xs text-graphite-muted">{ROLE_LABELS[l.role]}</span>
              </li>
            ))}
          </ul>
        )}
      </main>
    </>
  );
}
