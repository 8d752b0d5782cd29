/** Where a person lands after signing in when no (acceptable) page was asked for. */
export const DEFAULT_AFTER_SIGN_IN = '/home';

const BASE = 'http://brixhouse.invalid';

/**
 * The same-origin path a sign-in link may send a person to, or `/home`.
 *
 * Browsers read `\` as `/` and drop tabs and newlines inside addresses, so `/\evil.example`
 * and `/<tab>/evil.example` are other sites: anything holding a backslash, whitespace or a
 * control character is refused, as is anything not starting with a single `/`.
 * Client-safe (the sign-in form and next-auth's redirect callback share it).
 */
export function safeCallbackPath(raw: string | null | undefined, fallback = DEFAULT_AFTER_SIGN_IN): string {
  if (typeof raw !== 'string' || raw.length === 0 || raw.length > 2000) return fallback;
  if (/[\u0000-\u0020\u007f\\]/.test(raw)) return fallback;
  if (!raw.startsWith('/') || raw.startsWith('//')) return fallback;
  let url: URL;
  try {
    url = new URL(raw, BASE);
  } catch {
    return fallback;
  }
  if (url.origin !== BASE) return fallback;
  const path = `${url.pathname}${url.search}${url.hash}`;
  // A path that decodes to another site on a second reading is refused too.
  if (path.startsWith('//') || /^\/(%2f|%5c)/i.test(path)) return fallback;
  return path;
}

/** An absolute address for next-auth's redirect callback: same origin only. */
export function safeRedirectUrl(url: string, baseUrl: string): string {
  const base = new URL(baseUrl);
  let candidate = url;
  if (!url.startsWith('/')) {
    try {
      const abs = new URL(url);
      if (abs.origin !== base.origin) return `${base.origin}${DEFAULT_AFTER_SIGN_IN}`;
      candidate = `${abs.pathname}${abs.search}${abs.hash}`;
    } catch {
      return `${base.origin}${DEFAULT_AFTER_SIGN_IN}`;
    }
  }
  return `${base.origin}${safeCallbackPath(candidate)}`;
}
