import { NextResponse, type NextRequest } from 'next/server';
import { COMMON_SECURITY_HEADERS, contentSecurityPolicy, makeNonce } from '@/lib/security/headers';
import { checkApiRequest, ownOrigins } from '@/lib/security/requests';

/**
 * In front of every page and route handler: API writes must come from the app's own pages with
 * a JSON body under the size limit; every page gets a fresh CSP nonce and the security headers;
 * API answers (personal data) are never cached.
 */
/** API paths whose handlers set their own Cache-Control (private, for the signed-in person only). */
const OWN_CACHING = ['/api/photos/'];

export function proxy(request: NextRequest) {
  const { pathname } = request.nextUrl;

  if (pathname.startsWith('/api/')) {
    const verdict = checkApiRequest({
      method: request.method,
      pathname,
      headers: request.headers,
      ownOrigins: ownOrigins(request.headers, request.nextUrl.protocol, [process.env.APP_URL, process.env.NEXTAUTH_URL]),
    });
    if (verdict) {
      const res = NextResponse.json({ error: { code: verdict.code, message: verdict.message } }, { status: verdict.status });
      return withHeaders(res, { 'Cache-Control': 'no-store' });
    }
    // Photos set their own private caching; every other answer is kept out of caches.
    return withHeaders(NextResponse.next(), OWN_CACHING.some((p) => pathname.startsWith(p)) ? {} : { 'Cache-Control': 'no-store' });
  }

  const nonce = makeNonce();
  const csp = contentSecurityPolicy(nonce, { dev: process.env.NODE_ENV === 'development' });
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set('x-nonce', nonce);
  requestHeaders.set('Content-Security-Policy', csp);
  const res = NextResponse.next({ request: { headers: requestHeaders } });
  return withHeaders(res, { 'Content-Security-Policy': csp });
}

function withHeaders(res: NextResponse, extra: Record<string, string>) {
  for (const [k, v] of Object.entries({ ...COMMON_SECURITY_HEADERS, ...extra })) res.headers.set(k, v);
  return res;
}

export const config = {
  matcher: [
    // Everything but the build's static files (those get their headers from next.config.mjs).
    '/((?!_next/static|_next/image|favicon.ico|icon.svg).*)',
  ],
};
