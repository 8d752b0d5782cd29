'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';

export interface SeasonActionsProps {
  seasonId: string;
  status: string;
}

/** Close the season, then settle it and send the statements (coordinator). */
export function SeasonActions({ seasonId, status }: SeasonActionsProps) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);

  async function act(path: 'close' | 'settlement/send') {
    setBusy(true);
    setMessage(null);
    try {
      const res = await fetch(`/api/seasons/${seasonId}/${path}`, { method: 'POST' });
      const body = await res.json().catch(() => null);
      if (!res.ok) setMessage(body?.error?.message ?? 'That did not work. Please try again.');
      else if (path === 'close') setMessage('The season is closed: no more lots or runs.');
      else setMessage(`Settled. ${body.queued} statement${body.queued === 1 ? '' : 's'} queued for e-mail.`);
      router.refresh();
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap gap-2">
        {status === 'open' && (
          <Button variant="secondary" loading={busy} onClick={() => act('close')}>
            Close the season
          </Button>
        )}
        {(status === 'closed' || status === 'settled') && (
          <Button loading={busy} onClick={() => act('settlement/send')}>
            {status === 'settled' ? 'Send statements not yet sent' : 'Settle and send statements'}
          </Button>
        )}
      </div>
      <p role="status" aria-live="polite" className="text-sm text-slate-muted">
        {message}
      </p>
    </div>
  );
}
