'use client';

import { useRouter } from 'next/navigation';
import { signOut } from 'next-auth/react';
import { useState, type FormEvent } from 'react';
import { toast } from 'sonner';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { Field, Input, fieldA11y } from '@/components/ui/input';
import { ApiClientError, apiSend } from '@/lib/client/api';

type Fields = Record<string, string>;

/** Sends a form's JSON and hands back the API's per-field messages (or a general one). */
function useSubmit() {
  const [busy, setBusy] = useState(false);
  const [fields, setFields] = useState<Fields>({});
  const [error, setError] = useState<string | null>(null);
  async function submit(url: string, body: unknown, method: 'POST' | 'PATCH' = 'POST'): Promise<boolean> {
    setBusy(true);
    setFields({});
    setError(null);
    try {
      await apiSend(method, url, body);
      return true;
    } catch (err) {
      if (err instanceof ApiClientError) {
        setFields(err.fields);
        if (!Object.keys(err.fields).length) setError(err.message);
      } else setError('Could not reach Brixhouse. Try again in a moment.');
      return false;
    } finally {
      setBusy(false);
    }
  }
  return { busy, fields, error, submit };
}

export function AccountForms({ name }: { name: string }) {
  const router = useRouter();
  const nameForm = useSubmit();
  const passwordForm = useSubmit();
  const everywhere = useSubmit();

  async function onName(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const value = String(new FormData(e.currentTarget).get('name') ?? '');
    if (await nameForm.submit('/api/account', { name: value }, 'PATCH')) {
      toast.success('Your name is saved.');
      router.refresh();
    }
  }

  async function onPassword(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const body = { currentPassword: String(form.get('currentPassword') ?? ''), newPassword: String(form.get('newPassword') ?? '') };
    // A new password ends every session, this one included: sign in again with it.
    if (await passwordForm.submit('/api/account/password', body)) await signOut({ callbackUrl: '/sign-in?reset=1' });
  }

  async function onEverywhere() {
    if (await everywhere.submit('/api/account/sign-out-everywhere', {})) await signOut({ callbackUrl: '/sign-in' });
  }

  return (
    <>
      <Card>
        <CardHeader>
          <CardTitle>Your name</CardTitle>
        </CardHeader>
        <CardBody>
          <form onSubmit={onName} className="flex flex-col gap-4" noValidate aria-label="Your name">
            {nameForm.error ? <Alert tone="danger">{nameForm.error}</Alert> : null}
            <Field label="Name" htmlFor="name" error={nameForm.fields.name}>
              <Input {...fieldA11y('name', nameForm.fields.name)} name="name" defaultValue={name} autoComplete="name" />
            </Field>
            <Button type="submit" loading={nameForm.busy} className="self-start">
              Save name
            </Button>
          </form>
        </CardBody>
      </Card>

      <Card>
        <CardHeader>
          <CardTitle>Change your password</CardTitle>
        </CardHeader>
        <CardBody>
          <form onSubmit={onPassword} className="flex flex-col gap-4" noValidate aria-label="Change your password">
            {passwordForm.error ? <Alert tone="danger">{passwordForm.error}</Alert> : null}
            <Field label="Current password" htmlFor="currentPassword" error={passwordForm.fields.currentPassword}>
              <Input {...fieldA11y('currentPassword', passwordForm.fields.currentPassword)} name="currentPassword" type="password" autoComplete="current-password" />
            </Field>
            <Field label="New password" htmlFor="newPassword" hint="At least 10 characters, at most 72 bytes. You sign in again afterwards." error={passwordForm.fields.newPassword}>
              <Input {...fieldA11y('newPassword', passwordForm.fields.newPassword, true)} name="newPassword" type="password" autoComplete="new-password" />
            </Field>
            <Button type="submit" loading={passwordForm.busy} className="self-start">
              Change password
            </Button>
          </form>
        </CardBody>
      </Card>

      <Card>
        <CardHeader>
          <CardTitle>Sign out everywhere</CardTitle>
        </CardHeader>
        <CardBody>
          <p>Ends your sessions on every phone, tablet and computer, this one included. Use it after signing in on a shared device.</p>
          {everywhere.error ? <Alert tone="danger">{everywhere.error}</Alert> : null}
          <Button variant="secondary" loading={everywhere.busy} onClick={onEverywhere} className="self-start">
            Sign out everywhere
          </Button>
        </CardBody>
      </Card>
    </>
  );
}
