'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import Link from 'next/link';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { apiFetch } from '@/lib/api-client';
import { applyApiError } from '@/lib/form-errors';
import { PasswordResetRequestSchema, PasswordSchema } from '@/lib/schemas/account';
import { Button } from './ui/button';
import { Field } from './ui/field';
import { Notice } from './ui/notice';

export function ForgotPasswordForm() {
  const [sent, setSent] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<z.input<typeof PasswordResetRequestSchema>>({
    resolver: zodResolver(PasswordResetRequestSchema),
  });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await apiFetch('/api/v1/account/password-reset', { method: 'POST', body: values });
      setSent(true);
    } catch (error) {
      setFormError(applyApiError(error, setError, ['email']));
    }
  });
  if (sent) return <Notice testId="reset-sent">If an account exists for that address, a reset link is on its way. It works once, for one hour.</Notice>;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <Field label="E-mail" type="email" autoComplete="email" error={formState.errors.email?.message} {...register('email')} />
      {formError ? <Notice tone="error">{formError}</Notice> : null}
      <Button type="submit" disabled={formState.isSubmitting}>
        Send a reset link
      </Button>
    </form>
  );
}

const NewPassword = z
  .object({ password: PasswordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { message: 'The two passwords differ', path: ['confirm'] });

export function ResetPasswordForm({ token }: { token: string }) {
  const [done, setDone] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<z.input<typeof NewPassword>>({ resolver: zodResolver(NewPassword) });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await apiFetch('/api/v1/account/password-reset/confirm', { method: 'POST', body: { token, password: values.password } });
      setDone(true);
    } catch (error) {
      setFormError(applyApiError(error, setError, ['password']));
    }
  });
  if (done)
    return (
      <Notice testId="reset-done">
        Your password is changed and your other sessions are signed out.{' '}
        <Link href="/sign-in" className="text-accent underline">
          Sign in
        </Link>
        .
      </Notice>
    );
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <Field label="New password" type="password" autoComplete="new-password" error={formState.errors.password?.message} {...register('password')} />
      <Field label="The same again" type="password" autoComplete="new-password" error={formState.errors.confirm?.message} {...register('confirm')} />
      {formError ? <Notice tone="error" testId="reset-error">{formError}</Notice> : null}
      <Button type="submit" disabled={formState.isSubmitting}>
        Set the new password
      </Button>
    </form>
  );
}
