import Link from 'next/link';
import type { ReactNode } from 'react';
import { BrandMark } from './brand-mark';

/** The top bar shared by the public and signed-in shells. */
export function SiteHeader({ children }: { children?: ReactNode }) {
  return (
    <header className="border-b-[0.5px] border-rule bg-paper">
      <div className="mx-auto flex h-14 max-w-page items-center justify-between px-6">
        <Link href="/" className="flex items-center gap-2 text-graphite" data-testid="brand">
          <BrandMark />
          <span className="text-[15px] font-semibold tracking-tight">Epicycle</span>
        </Link>
        <nav aria-label="Account" className="flex items-center gap-4 text-sm">
          {children}
        </nav>
      </div>
    </header>
  );
}
