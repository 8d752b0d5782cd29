import AxeBuilder from '@axe-core/playwright';
import type { Page } from '@playwright/test';
import { test, expect } from './fixtures';

/**
 * Every page of Brixhouse, opened by a role that may open it, checked with axe-core at phone and
 * desktop width: no serious or critical violation, and on the phone no sideways scrolling.
 */

interface Visit {
  /** What the failure messages call the page. */
  name: string;
  /** The address, or how to reach a page whose address holds an id. */
  open: string | ((page: Page) => Promise<void>);
}

const WIDTHS = [
  { label: 'phone', use: { viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true }, phone: true },
  { label: 'desktop', use: { viewport: { width: 1280, height: 900 } }, phone: false },
] as const;

/** The member's statement of last season, reached from the Today page as a member finds it. */
async function openStatement(page: Page) {
  await page.goto('/home');
  const link = page.getByRole('link', { name: /statement$/ }).first();
  await expect(link).toBeVisible();
  await page.goto((await link.getAttribute('href'))!);
  await expect(page).toHaveURL(/\/statements\/[0-9a-f-]+$/);
}

/** The sugarhouse screen: the coordinator makes a display link in Settings and it is opened. */
async function openDisplay(page: Page) {
  await page.goto('/settings');
  await page.getByLabel('Screen name').fill(`Axe check ${Date.now()}`);
  await page.getByRole('button', { name: 'Make a display link' }).click();
  const url = (await page.getByTestId('display-link-url').textContent())!.trim();
  await page.goto(new URL(url).pathname);
  await expect(page.getByRole('heading', { name: 'Next to boil' })).toBeVisible();
}

const ROUNDS: { who: string | null; visits: Visit[] }[] = [
  {
    who: null,
    visits: [
      { name: 'landing', open: '/' },
      { name: 'sign-in', open: '/sign-in' },
      { name: 'forgot password', open: '/forgot-password' },
    ],
  },
  {
    who: 'okafor@larkspur.example',
    visits: [
      { name: 'Today', open: '/home' },
      { name: 'Boil calendar', open: '/calendar' },
      { name: 'Our drop-offs', open: '/deliveries' },
      { name: 'Boil queue', open: '/queue' },
      { name: 'Season ledger (member)', open: '/ledger' },
      { name: 'Your account', open: '/account' },
      { name: 'statement', open: openStatement },
    ],
  },
  {
    who: 'sugarmaker@larkspur.example',
    visits: [
      { name: 'Drop-off desk', open: '/deliveries' },
      { name: 'Runs', open: '/runs' },
      { name: 'Sugarhouse', open: '/sugarhouse' },
    ],
  },
  {
    who: 'coordinator@larkspur.example',
    visits: [
      { name: 'Today (coordinator)', open: '/home' },
      { name: 'Season ledger (coordinator)', open: '/ledger' },
      { name: 'Households', open: '/households' },
      { name: 'Settings', open: '/settings' },
      { name: 'sugarhouse display', open: openDisplay },
    ],
  },
];

/** axe's serious and critical findings, one line each with where they are. */
async function seriousProblems(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page }).analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id} (${v.impact}): ${v.nodes.map((n) => n.target.join(' ')).slice(0, 5).join(', ')}`);
}

async function pageWidth(page: Page) {
  return page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, width: document.documentElement.clientWidth }));
}

for (const width of WIDTHS) {
  test.describe(`every page at ${width.label} width`, () => {
    test.use(width.use);

    for (const round of ROUNDS) {
      const who = round.who ? round.who.split('@')[0] : 'signed out';
      test(`${who}: ${round.visits.map((v) => v.name).join(', ')}`, async ({ page, signInPage }) => {
        test.setTimeout(60_000 + round.visits.length * 45_000);
        if (round.who) {
          await signInPage.signIn(round.who);
          // A cold server renders the first signed-in page slowly.
          await expect(page.getByTestId('signed-in-as')).toBeVisible({ timeout: 30_000 });
        }
        for (const visit of round.visits) {
          if (typeof visit.open === 'string') await page.goto(visit.open);
          else await visit.open(page);
          // Late content (the calendar, lazily loaded charts, fonts) settles before measuring.
          await page.waitForLoadState('networkidle');
          await expect(page.locator('h1').first()).toBeVisible();

          expect.soft(await seriousProblems(page), `axe on ${visit.name} (${page.url()})`).toEqual([]);
          if (width.phone) {
            const { scroll, width: w } = await pageWidth(page);
            expect.soft(scroll, `${visit.name} (${page.url()}) is ${scroll}px wide in a ${w}px window`).toBeLessThanOrEqual(w);
          }
        }
      });
    }
  });
}
