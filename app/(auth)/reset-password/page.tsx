import type { Metadata } from 'next';
import { ResetPasswordForm } from '@/components/password-reset-forms';
import { Notice } from '@/components/ui/notice';

export const metadata: Metadata = { title: 'Choose a new password' };

export default async function ResetPasswordPage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  return (
    <>
      <h1 className="mb-8 text-2xl font-semibold">Choose a new password</h1>
      {token ? <ResetPasswordForm token={token} /> : <Notice tone="error">This link is incomplete. Open it again from the e-mail.</Notice>}
    </>
  );
}
