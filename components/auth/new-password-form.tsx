'use client';

import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, Input, fieldA11y } from '@/components/ui/input';
import { ApiClientError, apiSend } from '@/lib/client/api';

interface NewPasswordFormProps {
  token: string;
  /** Where the token and the password go: the invitation's or the reset link's acceptance. */
  endpoint: '/api/invitations/accept' | '/api/password-resets/accept';
  /** The sign-in page, with a flag saying the password was saved. */
  doneHref: string;
}

/** Choosing a password from a one-time link (an invitation or a reset). */
export function NewPasswordForm({ token, endpoint, doneHref }: NewPasswordFormProps) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [fieldError, setFieldError] = useState<string | undefined>();
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const password = String(form.get('password') ?? '');
    if (password !== String(form.get('confirm') ?? '')) {
      setFieldError('The two passwords differ.');
      return;
    }
    setBusy(true);
    setError(null);
    setFieldError(undefined);
    try {
      await apiSend('POST', endpoint, { token, password });
      router.replace(doneHref);
    } catch (err) {
      if (err instanceof ApiClientError) {
        setFieldError(err.fields.password);
        if (!err.fields.password) setError(err.message);
      } else setError('Could not reach Brixhouse. Try again in a moment.');
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate>
      {error ? <Alert tone="danger">{error}</Alert> : null}
      <Field label="New password" htmlFor="password" hint="At least 10 characters, at most 72 bytes." error={fieldError}>
        <Input {...fieldA11y('password', fieldError, true)} name="password" type="password" autoComplete="new-password" />
      </Field>
      <Field label="The same password again" htmlFor="confirm">
        <Input id="confirm" name="confirm" type="password" autoComplete="new-password" />
      </Field>
      <Button type="submit" size="lg" loading={busy}>
        Save password
      </Button>
    </form>
  );
}
