'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { signIn } from 'next-auth/react';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { apiFetch } from '@/lib/api-client';
import { applyApiError } from '@/lib/form-errors';
import { PASSWORD_MIN_LENGTH, PasswordSchema, PersonNameSchema } from '@/lib/schemas/account';
import { Button } from './ui/button';
import { Field } from './ui/field';
import { Notice } from './ui/notice';

const NewMember = z.object({ name: PersonNameSchema, password: PasswordSchema });

/** A new user sets their name and password; the account gets the invited address and joins the lab. */
export function AcceptAsNewUserForm({ token, email }: { token: string; email: string }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<z.input<typeof NewMember>>({ resolver: zodResolver(NewMember) });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const { labSlug } = await apiFetch<{ labSlug: string }>('/api/v1/invitations/accept', { method: 'POST', body: { token, ...values } });
      await signIn('credentials', { email, password: values.password, redirect: false });
      router.push(`/labs/${labSlug}`);
      router.refresh();
    } catch (error) {
      setFormError(applyApiError(error, setError, ['name', 'password']));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" data-testid="accept-new-form">
      <Field label="E-mail" value={email} readOnly disabled />
      <Field label="Your name" autoComplete="name" error={formState.errors.name?.message} data-testid="accept-name" {...register('name')} />
      <Field
        label="Choose a password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        error={formState.errors.password?.message}
        data-testid="accept-password"
        {...register('password')}
      />
      {formError ? <Notice tone="error" testId="accept-error">{formError}</Notice> : null}
      <Button type="submit" disabled={formState.isSubmitting} data-testid="accept-submit">
        Join the lab
      </Button>
    </form>
  );
}

/** A signed-in user whose address the invitation names accepts with one click. */
export function AcceptAsMemberButton({ token, labSlug }: { token: string; labSlug: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  return (
    <div className="space-y-4">
      {error ? <Notice tone="error" testId="accept-error">{error}</Notice> : null}
      <Button
        data-testid="accept-join"
        disabled={busy}
        onClick={async () => {
          setBusy(true);
          setError(null);
          try {
            await apiFetch(`/api/v1/labs/${labSlug}/members`, { method: 'POST', body: { token } });
            router.push(`/labs/${labSlug}`);
            router.refresh();
          } catch (e) {
            setError(e instanceof Error ? e.message : 'Could not join the lab.');
            setBusy(false);
          }
        }}
      >
        Join the lab
      </Button>
    </div>
  );
}
