'use client';

import { useEffect } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';

export default function CalendarError({ error, retry, reset }: { error: unknown; retry?: () => void; reset?: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);

  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-3xl font-bold">Boil calendar</h1>
      <Alert tone="danger" title="The Boil calendar could not be shown.">
        <p>Your bookings are safe. Try again; if it keeps happening, tell your coordinator.</p>
      </Alert>
      <div>
        <Button onClick={() => (retry ?? reset)?.()}>Try again</Button>
      </div>
    </div>
  );
}
