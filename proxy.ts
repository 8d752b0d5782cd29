import { NextResponse, type NextRequest } from 'next/server';
import { COMMON_SECURITY_HEADERS, contentSecurityPolicy, makeNonce } from '@/lib/security/headers';

/**
 * In front of every page: a fresh CSP nonce and the security headers. API routes are not here:
 * they take their checks and headers inside the handler (lib/security/api-guard), which costs
 * far less per request than a pass through the proxy.
 */
export function proxy(request: NextRequest) {
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
    // Every page: not the API (lib/security/api-guard) nor the build's static files (those get
    // their headers from next.config.mjs).
    '/((?!api/|_next/static|_next/image|favicon.ico|icon.svg).*)',
  ],
};
