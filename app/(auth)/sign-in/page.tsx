import type { Metadata } from 'next';
import Link from 'next/link';
import { SignInForm } from '@/components/sign-in-form';

export const metadata: Metadata = { title: 'Sign in' };

/** Only same-site paths are followed after sign-in. */
function safeCallback(value: string | string[] | undefined): string {
  const v = Array.isArray(value) ? value[0] : value;
  return v && v.startsWith('/') && !v.startsWith('//') ? v : '/labs';
}

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  return (
    <>
      <h1 className="text-2xl font-semibold">Sign in</h1>
      <p className="mt-2 mb-8 text-sm text-graphite-soft">
        No account yet?{' '}
        <Link href="/sign-up" className="text-accent underline underline-offset-2 hover:text-accent-strong">
          Start a lab
        </Link>
        .
      </p>
      <SignInForm callbackUrl={safeCallback(params.callbackUrl)} />
    </>
  );
}
