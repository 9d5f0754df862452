import type { Metadata } from 'next';
import { ForgotPasswordForm } from '@/components/password-reset-forms';

export const metadata: Metadata = { title: 'Reset your password' };

export default function ForgotPasswordPage() {
  return (
    <>
      <h1 className="text-2xl font-semibold">Reset your password</h1>
      <p className="mt-2 mb-8 text-sm text-graphite-soft">We will e-mail you a link to choose a new one.</p>
      <ForgotPasswordForm />
    </>
  );
}
