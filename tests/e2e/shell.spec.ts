import AxeBuilder from '@axe-core/playwright';
import type { Page } from '@playwright/test';
import { test, expect, openMore } from './fixtures';

const ROLES = [
  {
    email: 'okafor@larkspur.example',
    daily: [['Calendar', '/calendar'], ['Drop-offs', '/deliveries'], ['Queue', '/queue'], ['Ledger', '/ledger']],
    more: [['Today', '/home'], ['Your account', '/account']],
  },
  {
    email: 'sugarmaker@larkspur.example',
    // On a phone the tab bar carries the short labels.
    daily: [['Calendar', '/calendar'], ['Drop-offs', '/deliveries'], ['Queue', '/queue'], ['Ledger', '/ledger']],
    more: [['Today', '/home'], ['Runs', '/runs'], ['Sugarhouse', '/sugarhouse'], ['Your account', '/account']],
  },
  {
    email: 'coordinator@larkspur.example',
    daily: [['Calendar', '/calendar'], ['Drop-offs', '/deliveries'], ['Queue', '/queue'], ['Ledger', '/ledger']],
    more: [['Today', '/home'], ['Runs', '/runs'], ['Households', '/households'], ['Sugarhouse', '/sugarhouse'], ['Settings', '/settings'], ['Your account', '/account']],
  },
] as const;

/** Content Security Policy reports the browser writes to the console. */
function watchCsp(page: Page): string[] {
  const violations: string[] = [];
  page.on('console', (msg) => {
    if (/Content Security Policy/i.test(msg.text())) violations.push(`${page.url()}: ${msg.text()}`);
  });
  return violations;
}

async function noSidewaysScroll(page: Page) {
  // Let late content (the calendar, fonts) settle before measuring.
  await page.waitForLoadState('networkidle');
  const { scroll, width } = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, width: document.documentElement.clientWidth }));
  expect(scroll, `${page.url()} is ${scroll}px wide in a ${width}px window`).toBeLessThanOrEqual(width);
}

test.describe('the phone shell at 360 px', () => {
  test.use({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true });

  for (const role of ROLES) {
    test(`${role.email.split('@')[0]}: every destination is reachable from the navigation and no page scrolls sideways`, async ({ page, signInAs }) => {
      test.setTimeout(240_000);
      const csp = watchCsp(page);
      await signInAs(role.email);
      await noSidewaysScroll(page);
      const main = page.getByRole('navigation', { name: 'Main' });

      for (const [name, href] of role.daily) {
        const link = main.getByRole('link', { name, exact: true });
        await expect(link).toBeVisible();
        const box = (await link.boundingBox())!;
        expect(box.height).toBeGreaterThanOrEqual(44);
        expect(box.width).toBeGreaterThanOrEqual(44);
        // The short label reads on one line (a wrapped inline label has one box per line).
        expect(await link.locator('span:visible').evaluate((el) => el.getClientRects().length)).toBe(1);
        await link.click();
        await expect(page).toHaveURL(new RegExp(`${href}$`), { timeout: 30_000 });
        await expect(main.getByRole('link', { name, exact: true })).toHaveAttribute('aria-current', 'page');
        await noSidewaysScroll(page);
      }
      for (const [name, href] of role.more) {
        const dialog = await openMore(page);
        await dialog.getByRole('link', { name, exact: true }).click();
        await expect(page).toHaveURL(new RegExp(`${href}$`), { timeout: 30_000 });
        await expect(dialog).toBeHidden();
        await noSidewaysScroll(page);
        // The current page is marked inside the dialog too.
        const again = await openMore(page);
        await expect(again.getByRole('link', { name, exact: true })).toHaveAttribute('aria-current', 'page');
        await page.keyboard.press('Escape');
      }
      expect(csp).toEqual([]);
    });
  }

  test('the "More" dialog works by keyboard: focus moves in, Escape closes it and focus returns', async ({ page, signInAs }) => {
    await signInAs('coordinator@larkspur.example');
    const more = page.getByRole('navigation', { name: 'Main' }).getByRole('button', { name: 'More' });
    await more.focus();
    await page.keyboard.press('Enter');
    const dialog = page.getByRole('dialog', { name: 'More' });
    await expect(dialog).toBeVisible();
    expect(await dialog.evaluate((d) => d.contains(document.activeElement))).toBe(true);
    await page.keyboard.press('Escape');
    await expect(dialog).toBeHidden();
    await expect(more).toBeFocused();
  });

  test('axe finds no serious or critical problem on the shell, closed and open', async ({ page, signInAs }) => {
    await signInAs('coordinator@larkspur.example');
    const closed = await new AxeBuilder({ page }).analyze();
    const bad = (r: typeof closed) => r.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
    expect(bad(closed)).toEqual([]);
    await openMore(page);
    const open = await new AxeBuilder({ page }).include('[role="dialog"]').analyze();
    expect(bad(open)).toEqual([]);
  });
});

test('the desktop shows the four daily jobs by name with "More" beside them, and no CSP problem on the calendar', async ({ page, signInAs }) => {
  const csp = watchCsp(page);
  await signInAs('coordinator@larkspur.example');
  const main = page.getByRole('navigation', { name: 'Main' });
  for (const name of ['Boil calendar', 'Drop-off desk', 'Boil queue', 'Season ledger']) await expect(main.getByRole('link', { name, exact: true })).toBeVisible();
  await main.getByRole('link', { name: 'Boil calendar' }).click();
  // A loaded two-core machine can take many seconds to hydrate the calendar.
  await expect(page.locator('.fc')).toBeVisible({ timeout: 45_000 });
  // The calendar's injected styles are in force (a CSP refusal would leave them out): its
  // own stylesheet lays the calendar out as a column (the app draws its own toolbar).
  await expect(page.locator('.fc').first()).toHaveCSS('flex-direction', 'column');
  expect(csp).toEqual([]);
});
