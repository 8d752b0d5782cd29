import { NextResponse } from 'next/server';
import { getSequelize } from '@/db';
import { mailHealthy } from '@/lib/mail/transport';
import { guarded } from '@/lib/security/api-guard';

export const dynamic = 'force-dynamic';

async function databaseHealthy() {
  try {
    await getSequelize().query('SELECT 1');
    return true;
  } catch {
    return false;
  }
}

/** Liveness of the app and the two services it needs; 503 when either is down. */
export const GET = guarded(async () => {
  const [database, mail] = await Promise.all([databaseHealthy(), mailHealthy()]);
  const ok = database && mail;
  return NextResponse.json(
    {
      ok,
      database: database ? 'up' : 'down',
      mail: mail ? 'up' : 'down',
      // The integration set-up reuses only a server started with the tests' environment.
      ...(process.env.BRIXHOUSE_TEST_SERVER === '1' ? { test: true } : {}),
    },
    { status: ok ? 200 : 503 },
  );
});
