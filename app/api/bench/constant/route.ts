import { NextResponse } from 'next/server';
import constant from '@/bench/constant.json';
import { guarded } from '@/lib/security/api-guard';

export const dynamic = 'force-dynamic';

/**
 * The framework's own ceiling for the benchmarks: a route handler answering constant JSON, with
 * no session, database or formatting. It exists only while BENCH_ROUTES=1 (npm run bench sets
 * it); otherwise it answers 404 like any unknown path. It passes the same checks and gets the same
 * headers as every API route (lib/security/api-guard).
 */
export const GET = guarded(() => {
  if (process.env.BENCH_ROUTES !== '1') {
    return NextResponse.json({ error: { code: 'not_found', message: 'Not found.' } }, { status: 404 });
  }
  return NextResponse.json(constant);
});
