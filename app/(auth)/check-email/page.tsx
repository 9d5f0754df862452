import type { Metadata } from 'next';

export const metadata: Metadata = { title: 'Check your e-mail' };

export default function CheckEmailPage() {
  return (
    <>
      <h1 className="text-2xl font-semibold">Check your e-mail</h1>
      <p className="mt-4 text-graphite-soft" data-testid="check-email">
        If an account exists for that address, a link is on its way. It works once. Nothing arrived after a few
        minutes? Look in your spam folder, or ask again.
      </p>
    </>
  );
}
