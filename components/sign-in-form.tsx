'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { signIn } from 'next-auth/react';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { EmailSchema } from '@/lib/schemas/account';
import { Button } from './ui/button';
import { Field } from './ui/field';
import { Notice } from './ui/notice';

const PasswordSignIn = z.object({ email: EmailSchema, password: z.string().min(1, 'Enter your password') });
const LinkSignIn = z.object({ email: EmailSchema });
type PasswordSignInInput = z.input<typeof PasswordSignIn>;

/** next-auth answers a failed credentials sign-in with this code when no message was thrown. */
const GENERIC_FAILURE = 'CredentialsSignin';

export function SignInForm({ callbackUrl }: { callbackUrl: string }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const [mode, setMode] = useState<'password' | 'link'>('password');
  const form = useForm<PasswordSignInInput>({ resolver: zodResolver(PasswordSignIn) });
  const linkForm = useForm<z.input<typeof LinkSignIn>>({ resolver: zodResolver(LinkSignIn) });

  const onPassword = form.handleSubmit(async (values) => {
    setFormError(null);
    const res = await signIn('credentials', { email: values.email, password: values.password, redirect: false });
    if (!res || res.error) {
      setFormError(!res || res.error === GENERIC_FAILURE ? 'That e-mail and password do not match an account.' : res.error);
      return;
    }
    router.push(callbackUrl);
    router.refresh();
  });

  const onLink = linkForm.handleSubmit(async (values) => {
    setFormError(null);
    await signIn('email', { email: values.email, redirect: false, callbackUrl });
    router.push('/check-email');
  });

  return (
    <div>
      <div role="tablist" aria-label="How to sign in" className="mb-6 flex gap-4 border-b-[0.5px] border-rule text-sm">
        {(['password', 'link'] as const).map((m) => (
          <button
            key={m}
            role="tab"
            type="button"
            aria-selected={mode === m}
            onClick={() => setMode(m)}
            className={`-mb-px border-b-2 pb-2 ${mode === m ? 'border-accent text-graphite' : 'border-transparent text-graphite-muted hover:text-graphite'}`}
          >
            {m === 'password' ? 'Password' : 'E-mail me a link'}
          </button>
        ))}
      </div>
      {mode === 'password' ? (
        <form onSubmit={onPassword} noValidate className="space-y-4" data-testid="sign-in-form">
          <Field label="E-mail" type="email" autoComplete="email" data-testid="sign-in-email" error={form.formState.errors.email?.message} {...form.register('email')} />
          <Field label="Password" type="password" autoComplete="current-password" data-testid="sign-in-password" error={form.formState.errors.password?.message} {...form.register('password')} />
          {formError ? <Notice tone="error" testId="sign-in-error">{formError}</Notice> : null}
          <div className="flex items-center justify-between">
            <Button type="submit" disabled={form.formState.isSubmitting} data-testid="sign-in-submit">
              {form.formState.isSubmitting ? 'Signing in…' : 'Sign in'}
            </Button>
            <Link href="/forgot-password" className="text-sm text-accent underline underline-offset-2 hover:text-accent-strong">
              Forgot your password?
            </Link>
          </div>
        </form>
      ) : (
        <form onSubmit={onLink} noValidate className="space-y-4" data-testid="sign-in-link-form">
          <Field label="E-mail" type="email" autoComplete="email" error={linkForm.formState.errors.email?.message} {...linkForm.register('email')} />
          <Button type="submit" disabled={linkForm.formState.isSubmitting}>
            Send me a sign-in link
          </Button>
        </form>
      )}
    </div>
  );
}
