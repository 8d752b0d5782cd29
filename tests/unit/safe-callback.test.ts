import { describe, expect, it } from 'vitest';
import { safeCallbackPath, safeRedirectUrl } from '@/lib/security/redirect';

describe('safeCallbackPath', () => {
  it.each([
    ['/calendar', '/calendar'],
    ['/calendar?view=week#today', '/calendar?view=week#today'],
    ['/households/../settings', '/settings'],
  ])('keeps the same-site path %j', (raw, want) => {
    expect(safeCallbackPath(raw)).toBe(want);
  });

  it.each([
    '/\\evil.example',
    '/\t/evil.example',
    '/\n/evil.example',
    '//evil.example',
    '///evil.example',
    '\\\\evil.example',
    'https://evil.example',
    'javascript:alert(1)',
    'evil.example',
    '/%2F%2Fevil.example',
    '/%5Cevil.example',
    ' /calendar',
    '',
    null,
    undefined,
  ])('sends %j home instead', (raw) => {
    expect(safeCallbackPath(raw)).toBe('/home');
  });
});

describe('safeRedirectUrl', () => {
  const base = 'http://127.0.0.1:3000';
  it('keeps addresses on this site', () => {
    expect(safeRedirectUrl('/calendar', base)).toBe(`${base}/calendar`);
    expect(safeRedirectUrl(`${base}/ledger?season=2`, base)).toBe(`${base}/ledger?season=2`);
  });
  it('sends any other site home', () => {
    expect(safeRedirectUrl('https://evil.example/x', base)).toBe(`${base}/home`);
    expect(safeRedirectUrl('/\\evil.example', base)).toBe(`${base}/home`);
    expect(safeRedirectUrl('http://127.0.0.1:3001/x', base)).toBe(`${base}/home`);
  });
});
