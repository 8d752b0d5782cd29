/**
 * The Content Security Policy of a page, with this request's nonce. Next.js reads the nonce
 * from the request's policy and puts it on its own scripts and styles; the calendar library
 * takes it from those scripts for the styles it injects.
 */
/**
 * The one <style> element a library of ours injects without a nonce: the toast library's own
 * stylesheet (sonner's `__insertCSS`), admitted by the hash of its exact text. It appends the
 * element empty and fills it after, so the empty text's hash is admitted too (an empty style
 * does nothing). A unit test recomputes the hash from the installed package, so an upgrade that
 * changes the text fails there.
 */
export const TOAST_STYLE_HASH = "'sha256-StEaX+se6YS7pqjzrzMIA0KaX9zF/8zAhvQXZAe5epY='";
const EMPTY_STYLE_HASH = "'sha256-47DEQpj8HBSa+/TImW+5JCeuQeRkm5NMpJWZG3hSuFU='";

export function contentSecurityPolicy(nonce: string, { dev = false } = {}): string {
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ''}`,
    `style-src 'self' 'nonce-${nonce}' ${TOAST_STYLE_HASH} ${EMPTY_STYLE_HASH}`,
    "img-src 'self' blob: data:",
    "font-src 'self' data:",
    "connect-src 'self'" + (dev ? ' ws: wss:' : ''),
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    "manifest-src 'self'",
    "worker-src 'self' blob:",
  ];
  return directives.join('; ');
}

/** Headers every answer carries, page or API. */
export const COMMON_SECURITY_HEADERS: Record<string, string> = {
  'X-Content-Type-Options': 'nosniff',
  'Referrer-Policy': 'same-origin',
  'X-Frame-Options': 'DENY',
  'Cross-Origin-Opener-Policy': 'same-origin',
  'Permissions-Policy': 'camera=(self), microphone=(), geolocation=(), payment=()',
};

/** A fresh nonce for one request (128 random bits, base64). */
export function makeNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}
