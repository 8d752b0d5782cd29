'use client';

import { setNonce } from 'get-nonce';

// Dialogs lock scrolling with a <style> element they create; the page's Content Security Policy
// admits it only with this request's nonce, which the framework put on its own scripts.
if (typeof document !== 'undefined') {
  const script = document.querySelector<HTMLScriptElement>('script[nonce]');
  if (script?.nonce) setNonce(script.nonce);
}

/** Renders nothing; importing it hands the page's CSP nonce to the style-injecting libraries. */
export function CspNonce() {
  return null;
}
