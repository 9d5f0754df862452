import type { Metadata } from 'next';
import Link from 'next/link';
import { SignUpForm } from '@/components/sign-up-form';

export const metadata: Metadata = { title: 'Start a lab' };

export default function SignUpPage() {
  return (
    <>
      <h1 className="text-2xl font-semibold">Start a lab</h1>
      <p className="mt-2 mb-8 text-sm text-graphite-soft">
        Already have an account?{' '}
        <Link href="/sign-in" className="text-accent underline underline-offset-2 hover:text-accent-strong">
          Sign in
        </Link>
        . Joining an existing lab? Use the link in your invitation e-mail.
      </p>
      <SignUpForm />
    </>
  );
}
