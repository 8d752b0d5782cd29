'use client';

import { useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, Input, fieldA11y } from '@/components/ui/input';
import { ApiClientError, apiSend } from '@/lib/client/api';

export function ForgotPasswordForm() {
  const [sent, setSent] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [fieldError, setFieldError] = useState<string | undefined>();
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const email = String(new FormData(e.currentTarget).get('email') ?? '');
    setBusy(true);
    setError(null);
    setFieldError(undefined);
    try {
      const res = await apiSend<{ message: string }>('POST', '/api/password-resets', { email });
      setSent(res.message);
    } catch (err) {
      if (err instanceof ApiClientError) {
        setFieldError(err.fields.email);
        if (!err.fields.email) setError(err.message);
      } else setError('Could not reach Brixhouse. Try again in a moment.');
    } finally {
      setBusy(false);
    }
  }

  if (sent) {
    return (
      <Alert tone="info" title="Check your inbox">
        {sent}
      </Alert>
    );
  }
  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate>
      {error ? <Alert tone="danger">{error}</Alert> : null}
      <Field label="E-mail" htmlFor="email" error={fieldError}>
        <Input {...fieldA11y('email', fieldError)} name="email" type="email" autoComplete="username" required />
      </Field>
      <Button type="submit" size="lg" loading={busy}>
        Send the link
      </Button>
    </form>
  );
}
