import { bodyLimitFor, UPLOAD_PATHS } from './limits';

/** Methods that change something. */
export const WRITE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

export interface RequestVerdict {
  status: number;
  code: string;
  message: string;
}

interface RequestFacts {
  method: string;
  pathname: string;
  headers: Headers;
  /** The origins that count as the app's own (its public address and the Host it was asked at). */
  ownOrigins: string[];
}

/** The origins a request may come from: the configured public address and the Host header. */
export function ownOrigins(headers: Headers, protocol: string, configured: (string | undefined)[]): string[] {
  const out = new Set<string>();
  for (const c of configured) {
    if (!c) continue;
    try {
      out.add(new URL(c).origin);
    } catch {
      /* not an address */
    }
  }
  const host = headers.get('x-forwarded-host') ?? headers.get('host');
  const proto = (headers.get('x-forwarded-proto') ?? protocol).replace(/:$/, '');
  if (host) out.add(`${proto}://${host}`);
  return [...out];
}

function mediaType(headers: Headers): string {
  return (headers.get('content-type') ?? '').split(';')[0].trim().toLowerCase();
}

/**
 * Whether an API request may go on to its route handler; null when it may.
 * A write must come from the app's own pages (Origin, or the browser's Sec-Fetch-Site), carry
 * JSON (multipart on upload routes; next-auth's own form posts under /api/auth, with their
 * length) and stay under the body limit.
 */
export function checkApiRequest({ method, pathname, headers, ownOrigins: own }: RequestFacts): RequestVerdict | null {
  const m = method.toUpperCase();
  if (!WRITE_METHODS.has(m)) return null;

  const origin = headers.get('origin');
  const fetchSite = headers.get('sec-fetch-site');
  if ((origin && origin !== 'null' && !own.includes(origin)) || origin === 'null' || (fetchSite && !['same-origin', 'none'].includes(fetchSite))) {
    return { status: 403, code: 'cross_origin', message: 'This request did not come from Brixhouse’s own pages.' };
  }

  const length = headers.get('content-length');
  const chunked = /chunked/i.test(headers.get('transfer-encoding') ?? '');
  const hasBody = chunked || (length !== null && Number(length) > 0);
  const limit = bodyLimitFor(pathname);
  if (length !== null && Number(length) > limit) {
    return { status: 413, code: 'body_too_large', message: `The request body is larger than ${Math.round(limit / 1024)} kB.` };
  }
  if (!hasBody) return null;
  // next-auth reads the sign-in form whole, with no limit of its own: it must say its length
  // (a browser's form post and next-auth's own client always do), so the limit above holds.
  if (chunked && length === null && pathname.startsWith('/api/auth/')) {
    return { status: 411, code: 'length_required', message: 'Send the sign-in form with its length (Content-Length).' };
  }

  const type = mediaType(headers);
  if (pathname.startsWith('/api/auth/')) {
    if (type === 'application/x-www-form-urlencoded' || type === 'application/json') return null;
  } else if (type === 'application/json') {
    return null;
  } else if (type === 'multipart/form-data' && UPLOAD_PATHS.some((p) => pathname === p || pathname.startsWith(`${p}/`))) {
    return null;
  }
  return {
    status: 415,
    code: 'unsupported_media_type',
    message: 'Send the request body as JSON (Content-Type: application/json).',
  };
}
