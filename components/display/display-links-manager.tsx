'use client';

import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, Input, fieldA11y } from '@/components/ui/input';
import { toast } from '@/components/ui/toaster';
import { ApiClientError, apiSend } from '@/lib/client/api';
import type { DisplayLinkDto } from '@/lib/display/types';

/** The coordinator makes, names and revokes the links that show the queue on sugarhouse screens. */
export function DisplayLinksManager({ initial }: { initial: DisplayLinkDto[] }) {
  const [links, setLinks] = useState(initial);
  const [name, setName] = useState('');
  const [error, setError] = useState<string | undefined>();
  const [busy, setBusy] = useState(false);
  const [made, setMade] = useState<{ name: string; url: string } | null>(null);

  const create = async (e: React.FormEvent) => {
    e.preventDefault();
    setBusy(true);
    setError(undefined);
    try {
      const link = await apiSend<DisplayLinkDto & { url: string }>('POST', '/api/display-links', { name });
      setLinks((all) => [link, ...all]);
      setMade({ name: link.name, url: link.url });
      setName('');
    } catch (err) {
      setError(err instanceof ApiClientError ? (err.fields.name ?? err.message) : 'Could not reach Brixhouse. Try again in a moment.');
    } finally {
      setBusy(false);
    }
  };

  const revoke = async (link: DisplayLinkDto) => {
    try {
      const done = await apiSend<DisplayLinkDto>('DELETE', `/api/display-links/${link.id}`);
      setLinks((all) => all.map((l) => (l.id === done.id ? done : l)));
      toast.success(`“${link.name}” no longer opens the display.`);
    } catch (err) {
      toast.error(err instanceof ApiClientError ? err.message : 'Could not reach Brixhouse.');
    }
  };

  return (
    <div className="flex flex-col gap-4">
      <form onSubmit={create} noValidate aria-label="New display link" className="grid gap-3 sm:grid-cols-[1fr_auto] sm:items-end">
        <Field label="Screen name" htmlFor="display-name" error={error}>
          <Input {...fieldA11y('display-name', error)} value={name} onChange={(e) => setName(e.target.value)} placeholder="Sugarhouse TV" />
        </Field>
        <Button type="submit" loading={busy}>
          Make a display link
        </Button>
      </form>
      {made ? (
        <Alert tone="info" title={`Link for “${made.name}”`}>
          <p>Open this address on the screen. It is shown only now; anyone with it sees the queue, so revoke it if it leaks.</p>
          <p className="break-all font-mono text-sm" data-testid="display-link-url">
            {made.url}
          </p>
          <div>
            <Button variant="secondary" size="sm" onClick={() => void navigator.clipboard?.writeText(made.url).then(() => toast.success('Copied.'))}>
              Copy the address
            </Button>
          </div>
        </Alert>
      ) : null}
      {links.length === 0 ? <p className="text-slate-muted">No display links yet.</p> : null}
      <ul className="flex flex-col gap-2" aria-label="Display links">
        {links.map((l) => (
          <li key={l.id} className="flex flex-wrap items-center justify-between gap-2 rounded-lg border border-birch-line p-3">
            <span>
              <span className="font-semibold">{l.name}</span>
              <span className="block text-sm text-slate-muted">
                made {l.createdAt.slice(0, 10)}
                {l.revokedAt ? ` · revoked ${l.revokedAt.slice(0, 10)}` : ''}
              </span>
            </span>
            {l.revokedAt ? (
              <span className="text-sm font-semibold text-slate-muted">Revoked</span>
            ) : (
              <Button variant="danger" size="sm" onClick={() => revoke(l)} aria-label={`Revoke ${l.name}`}>
                Revoke
              </Button>
            )}
          </li>
        ))}
      </ul>
    </div>
  );
}
