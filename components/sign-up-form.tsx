'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { signIn } from 'next-auth/react';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { apiFetch } from '@/lib/api-client';
import { applyApiError } from '@/lib/form-errors';
import { PASSWORD_MIN_LENGTH, SignUpSchema, type SignUpInput } from '@/lib/schemas/account';
import { Button } from './ui/button';
import { Field } from './ui/field';
import { Notice } from './ui/notice';

const FIELDS = ['name', 'email', 'password', 'labName'] as const;

export function SignUpForm() {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<SignUpInput>({ resolver: zodResolver(SignUpSchema) });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const { labSlug } = await apiFetch<{ labSlug: string }>('/api/v1/account', { method: 'POST', body: values });
      await signIn('credentials', { email: values.email, password: values.password, redirect: false });
      router.push(`/labs/${labSlug}`);
      router.refresh();
    } catch (error) {
      setFormError(applyApiError(error, setError, FIELDS));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" data-testid="sign-up-form">
      <Field label="Your name" autoComplete="name" error={formState.errors.name?.message} data-testid="sign-up-name" {...register('name')} />
      <Field label="E-mail" type="email" autoComplete="email" error={formState.errors.email?.message} data-testid="sign-up-email" {...register('email')} />
      <Field
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters. A passphrase works well.`}
        error={formState.errors.password?.message}
        data-testid="sign-up-password"
        {...register('password')}
      />
      <Field label="Lab name" hint="You will be its Owner; invite your colleagues next." error={formState.errors.labName?.message} data-testid="sign-up-lab" {...register('labName')} />
      {formError ? <Notice tone="error" testId="sign-up-error">{formError}</Notice> : null}
      <Button type="submit" disabled={formState.isSubmitting} data-testid="sign-up-submit">
        {formState.isSubmitting ? 'Creating your lab…' : 'Create account and lab'}
      </Button>
    </form>
  );
}
