import type { Metadata } from 'next';
import { AcceptAsMemberButton, AcceptAsNewUserForm } from '@/components/accept-invitation';
import { ButtonLink } from '@/components/ui/button-link';
import { Notice } from '@/components/ui/notice';
import { findUserById } from '@/db/repositories/users';
import { ROLE_LABELS } from '@/lib/schemas/roles';
import { getPagePrincipal } from '@/lib/server/auth/principal';
import { getDb } from '@/lib/server/db';
import { previewInvitation } from '@/lib/server/services/invitations';

export const metadata: Metadata = { title: 'Invitation' };

const UNUSABLE = {
  unknown: 'This invitation link is not valid. Check that you opened the whole link from the e-mail.',
  expired: 'This invitation has expired. Ask the lab Owner to send it again.',
  accepted: 'This invitation was already used.',
  revoked: 'This invitation was withdrawn by the lab.',
} as const;

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const db = getDb();
  const preview = await previewInvitation(db, token);
  if (preview.state !== 'pending') {
    return (
      <>
        <h1 className="mb-6 text-2xl font-semibold">Invitation</h1>
        <Notice tone="error" testId="invite-unusable">{UNUSABLE[preview.state]}</Notice>
      </>
    );
  }
  const principal = await getPagePrincipal();
  const me = principal.kind === 'user' ? await findUserById(db, principal.userId) : undefined;
  const callback = encodeURIComponent(`/invite/${token}`);
  return (
    <>
      <h1 className="text-2xl font-semibold">Join {preview.labName}</h1>
      <p className="mt-2 mb-8 text-graphite-soft" data-testid="invite-summary">
        You are invited as <strong className="font-medium text-graphite">{ROLE_LABELS[preview.role!]}</strong>, at{' '}
        <span className="tabular">{preview.email}</span>.
      </p>
      {me && me.email !== preview.email ? (
        <Notice tone="error" testId="invite-wrong-user">
          This invitation is for {preview.email}, but you are signed in as {me.email}. Sign out, then open the link
          again.
        </Notice>
      ) : me ? (
        <AcceptAsMemberButton token={token} labSlug={preview.labSlug!} />
      ) : preview.hasAccount ? (
        <div className="space-y-4">
          <p className="text-sm">You already have an account. Sign in to accept.</p>
          <ButtonLink href={`/sign-in?callbackUrl=${callback}`}>Sign in to accept</ButtonLink>
        </div>
      ) : (
        <AcceptAsNewUserForm token={token} email={preview.email!} />
      )}
    </>
  );
}
