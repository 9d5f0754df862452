'use client';

import { signOut } from 'next-auth/react';
import { useState } from 'react';
import { apiFetch } from '@/lib/api-client';

/** The signed-in user's name with sign-out, and sign-out on every device. */
export function AccountMenu({ name }: { name: string }) {
  const [open, setOpen] = useState(false);
  return (
    <div className="relative">
      <button
        type="button"
        aria-expanded={open}
        aria-haspopup="menu"
        onClick={() => setOpen((o) => !o)}
        className="text-sm text-graphite-soft hover:text-graphite"
        data-testid="account-menu"
      >
        {name} ▾
      </button>
      {open ? (
        <div role="menu" className="absolute right-0 z-20 mt-2 w-56 border-[0.5px] border-rule bg-paper-raised py-1 text-sm shadow-sm">
          <button role="menuitem" type="button" className="block w-full px-4 py-2 text-left hover:bg-paper-deep" onClick={() => signOut({ callbackUrl: '/' })} data-testid="sign-out">
            Sign out
          </button>
          <button
            role="menuitem"
            type="button"
            className="block w-full px-4 py-2 text-left hover:bg-paper-deep"
            data-testid="sign-out-everywhere"
            onClick={async () => {
              await apiFetch('/api/v1/account/sign-out-everywhere', { method: 'POST' });
              await signOut({ callbackUrl: '/sign-in' });
            }}
          >
            Sign out on every device
          </button>
        </div>
      ) : null}
    </div>
  );
}
