'use client';

import { signIn } from 'next-auth/react';
import Link from 'next/link';
import { useRouter, useSearchParams } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, Input, fieldA11y } from '@/components/ui/input';
import { safeCallbackPath } from '@/lib/security/redirect';

export function SignInForm() {
  const router = useRouter();
  const params = useSearchParams();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [locked, setLocked] = useState(false);

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
    if (result?.status === 429 || result?.error === 'TooManyAttempts') {
      setError('Too many sign-in attempts for this account. Wait a minute, then try again — or choose a new password with the link below.');
      setLocked(true);
      return;
    }
    if (!result || result.error) {
      setError('That e-mail and password do not match an account. Check both and try again.');
      setLocked(false);
      return;
    }
    router.replace(safeCallbackPath(params.get('callbackUrl')));
    router.refresh();
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate>
      {(params.get('welcome') || params.get('reset')) && !error ? (
        <Alert tone="info" title="Password saved">
          Sign in with your e-mail address and the password you just chose.
        </Alert>
      ) : null}
      {error ? (
        <Alert tone="danger" title={locked ? 'Sign-in paused' : 'Not signed in'}>
          {error}
        </Alert>
      ) : null}
      <Field label="E-mail" htmlFor="email">
        <Input id="email" aria-invalid={!!error || undefined} name="email" type="email" autoComplete="username" required />
      </Field>
      <Field label="Password" htmlFor="password" error={error && !locked ? 'Check the password, or the e-mail above it.' : undefined}>
        <Input {...fieldA11y('password', error)} name="password" type="password" autoComplete="current-password" required />
      </Field>
      <Button type="submit" size="lg" loading={busy}>
        Sign in
      </Button>
      <Link href="/forgot-password" className="inline-flex min-h-touch items-center self-start rounded-lg font-semibold text-spruce-strong underline underline-offset-4">
        Forgot your password?
      </Link>
    </form>
  );
}
