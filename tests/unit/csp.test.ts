import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { contentSecurityPolicy, TOAST_STYLE_HASH } from '@/lib/security/headers';

/** The stylesheet text the installed toast library injects at load, as the browser hashes it. */
function injectedToastCss(file: string): string {
  const source = readFileSync(file, 'utf8');
  const literal = /__insertCSS\(("(?:[^"\\]|\\.)*")\)/.exec(source);
  if (!literal) throw new Error(`no injected stylesheet found in ${file}`);
  return JSON.parse(literal[1]) as string;
}

describe('the Content Security Policy of a page', () => {
  const dist = path.dirname(createRequire(import.meta.url).resolve('sonner'));

  it.each(['index.mjs', 'index.js'])('admits the toast library’s injected stylesheet (%s) by the hash of its exact text', (file) => {
    const css = injectedToastCss(path.join(dist, file));
    const hash = `'sha256-${createHash('sha256').update(css, 'utf8').digest('base64')}'`;
    expect(hash).toBe(TOAST_STYLE_HASH);
  });

  it('allows styles only from the app, this request’s nonce, that hash and an empty style: no unsafe-inline', () => {
    const policy = contentSecurityPolicy('abc123');
    const style = policy.split('; ').find((d) => d.startsWith('style-src '))!;
    const empty = `'sha256-${createHash('sha256').update('').digest('base64')}'`;
    expect(style).toBe(`style-src 'self' 'nonce-abc123' ${TOAST_STYLE_HASH} ${empty}`);
    expect(policy).not.toContain('unsafe-inline');
    expect(policy).toContain("frame-ancestors 'none'");
  });
});
