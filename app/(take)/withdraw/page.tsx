import type { Metadata } from 'next';
import { WithdrawForm } from '@/components/withdraw-form';

export const metadata: Metadata = { title: 'Withdraw from a study', robots: { index: false } };

export default function WithdrawPage() {
  return (
    <main className="mx-auto max-w-xl space-y-4 px-6 py-16">
      <h1 className="text-2xl font-semibold">Withdraw from a study</h1>
      <p>Type the session code you were shown at the end of the study. Everything you answered in that session is deleted; you need give no reason.</p>
      <WithdrawForm />
    </main>
  );
}
