'use client';

import { signOut } from 'next-auth/react';
import { useState } from 'react';
import { Button } from '@/components/ui/button';

export function SignOutButton() {
  const [busy, setBusy] = useState(false);
  return (
    <Button
      variant="ghost"
      size="sm"
      loading={busy}
      onClick={() => {
        setBusy(true);
        void signOut({ callbackUrl: '/sign-in' });
      }}
    >
      Sign out
    </Button>
  );
}
