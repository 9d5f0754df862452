import Link from 'next/link';
import { notFound } from 'next/navigation';
import type { ReactNode } from 'react';
import { SiteHeader } from '@/components/site-header';
import { LabNav } from '@/components/lab-nav';
import { findLabBySlug } from '@/db/repositories/labs';
import { getDb } from '@/lib/server/db';

export default async function LabLayout({
  children,
  params,
}: {
  children: ReactNode;
  params: Promise<{ lab: string }>;
}) {
  const { lab: slug } = await params;
  const lab = await findLabBySlug(getDb(), slug);
  if (!lab) notFound();
  return (
    <>
      <SiteHeader>
        <Link href={`/labs/${lab.slug}`} className="text-graphite-soft hover:text-graphite" data-testid="lab-name">
          {lab.name}
        </Link>
      </SiteHeader>
      <div className="mx-auto grid max-w-page gap-8 px-6 py-8 md:grid-cols-[12rem_1fr]">
        <LabNav lab={lab.slug} />
        <main id="main" className="min-w-0">
          {children}
        </main>
      </div>
    </>
  );
}
