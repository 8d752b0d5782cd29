'use client';

import { signIn } from 'next-auth/react';
import { useRouter, useSearchParams } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, Input, fieldA11y } from '@/components/ui/input';

export function SignInForm() {
  const router = useRouter();
  const params = useSearchParams();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setBusy(true);
    setError(null);
    const result = await signIn('credentials', {
      email: String(form.get('email') ?? ''),
      password: String(form.get('password') ?? ''),
      redirect: false,
    });
    setBusy(false);
    if (!result || result.error) {
      setError('That e-mail and password do not match an account. Check both and try again.');
      return;
    }
    const next = params.get('callbackUrl');
    router.replace(next && next.startsWith('/') && !next.startsWith('//') ? next : '/home');
    router.refresh();
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate>
      {params.get('welcome') && !error ? (
        <Alert tone="info" title="Password saved">
          Sign in with your e-mail address and the password you just chose.
        </Alert>
      ) : null}
      {error ? (
        <Alert tone="danger" title="Not signed in">
          {error}
        </Alert>
      ) : null}
      <Field label="E-mail" htmlFor="email">
        <Input id="email" aria-invalid={!!error || undefined} name="email" type="email" autoComplete="username" required />
      </Field>
      <Field label="Password" htmlFor="password" error={error ? 'Check the password, or the e-mail above it.' : undefined}>
        <Input {...fieldA11y('password', error)} name="password" type="password" autoComplete="current-password" required />
      </Field>
      <Button type="submit" size="lg" loading={busy}>
        Sign in
      </Button>
    </form>
  );
}
