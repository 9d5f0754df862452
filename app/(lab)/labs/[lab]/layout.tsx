import type { ReactNode } from 'react';
import { AccountMenu } from '@/components/account-menu';
import { LabNav } from '@/components/lab-nav';
import { LabSwitcher } from '@/components/lab-switcher';
import { QueryProvider } from '@/components/query-provider';
import { SiteHeader } from '@/components/site-header';
import { ROLE_LABELS } from '@/lib/schemas/roles';
import { getDb } from '@/lib/server/db';
import { requireLabPageActor } from '@/lib/server/page-context';
import { listMyLabs } from '@/lib/server/services/labs';

export default async function LabLayout({ children, params }: { children: ReactNode; params: Promise<{ lab: string }> }) {
  const { lab: slug } = await params;
  const { actor, user } = await requireLabPageActor(slug);
  const labs = await listMyLabs(getDb(), user.id);
  return (
    <QueryProvider>
      <SiteHeader>
        <LabSwitcher current={actor.labSlug} labs={labs} />
        <span className="tabular text-xs text-graphite-muted" data-testid="my-role">
          {ROLE_LABELS[actor.role]}
        </span>
        <AccountMenu name={user.name} />
      </SiteHeader>
      <div className="mx-auto grid max-w-page gap-8 px-6 py-8 md:grid-cols-[12rem_1fr]">
        <LabNav lab={actor.labSlug} />
        <main id="main" className="min-w-0">
          {children}
        </main>
      </div>
    </QueryProvider>
  );
}
