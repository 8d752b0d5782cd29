import { randomUUID } from 'node:crypto';
import type { Browser, BrowserContext, Page } from '@playwright/test';
import { expect, SignInPage, test } from './fixtures';

// Sign-in and first page loads are slow on a shared two-core machine; the live-update checks keep their own limits.
test.describe.configure({ timeout: 240_000 });

async function signedInPage(browser: Browser, email: string, viewport = { width: 1024, height: 900 }): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport });
  const page = await context.newPage();
  await new SignInPage(page).signIn(email);
  await expect(page.getByTestId('signed-in-as')).toBeVisible();
  return { context, page };
}

/** A drop-off logged through the API with the sugarmaker's own session (the drop-off desk has its own e2e test). */
async function logDropOff(page: Page, householdId: string, volumeL: number) {
  const collectedOn = new Intl.DateTimeFormat('en-CA', { timeZone: 'America/New_York' }).format(new Date());
  const res = await page.request.post('/api/deliveries', {
    data: { householdId, volumeL, brix: 2.6, sapTempC: 2.5, collectedOn, clarity: 'clear', contamination: 'none', idempotencyKey: `e2e-${randomUUID()}` },
  });
  expect(res.status()).toBe(201);
  return ((await res.json()) as { id: string }).id;
}

test('a drop-off reaches a member’s Boil queue within a second, and an offline phone catches up when back online', async ({ browser }) => {
  const staff = await signedInPage(browser, 'sugarmaker@larkspur.example');
  const member = await signedInPage(browser, 'brennan@larkspur.example', { width: 360, height: 780 });
  await member.page.goto('/queue');
  await expect(member.page.getByRole('heading', { name: 'Boil queue' })).toBeVisible();
  await expect(member.page.getByTestId('live-status')).toHaveAttribute('data-status', 'live');
  // Own lots are marked.
  await expect(member.page.getByTestId('own-summary')).toBeVisible();

  // The member's own household, from its own lots.
  const own = (await (await member.page.request.get('/api/deliveries')).json()) as { householdId: string }[];
  const householdId = own[0].householdId;
  const id = await logDropOff(staff.page, householdId, 187.5);
  const written = Date.now();
  await member.page.locator(`[data-delivery-id="${id}"]`).waitFor({ timeout: 5_000 });
  expect(Date.now() - written).toBeLessThan(1_000);
  await expect(member.page.locator(`[data-delivery-id="${id}"]`)).toContainText('Yours');

  // Offline: the page drops its socket; a change meanwhile does not reach it.
  await member.context.setOffline(true);
  await expect(member.page.getByTestId('live-status')).toHaveAttribute('data-status', 'offline');
  const missed = await logDropOff(staff.page, householdId, 93.2);
  await member.page.waitForTimeout(1_500);
  await expect(member.page.locator(`[data-delivery-id="${missed}"]`)).toHaveCount(0);
  // Back online: it resynchronises and shows the current queue, without a reload.
  await member.context.setOffline(false);
  await expect(member.page.locator(`[data-delivery-id="${missed}"]`)).toBeVisible({ timeout: 10_000 });
  await expect(member.page.getByTestId('live-status')).toHaveAttribute('data-status', 'live');
  await member.page.screenshot({ path: '.tmp/screens/queue-360.png', fullPage: true });

  await staff.context.close();
  await member.context.close();
});

test('the sugarhouse display updates when a draw-off is recorded on the Runs screen', async ({ browser }) => {
  const coordinator = await signedInPage(browser, 'coordinator@larkspur.example', { width: 1024, height: 1300 });
  await coordinator.page.goto('/settings');
  await coordinator.page.getByLabel('Screen name').fill('Sugarhouse TV');
  await coordinator.page.getByRole('button', { name: 'Make a display link' }).click();
  const url = (await coordinator.page.getByTestId('display-link-url').textContent())!.trim();

  const tv = await browser.newContext({ viewport: { width: 1920, height: 1080 } });
  const screen = await tv.newPage();
  await screen.goto(new URL(url).pathname);
  await expect(screen.getByRole('heading', { name: 'Next to boil' })).toBeVisible();
  await expect(screen.getByRole('status')).toContainText('Live');

  // The sugarmaker's tablet: start a run, take the head of the queue, draw off.
  const runs = coordinator.page;
  await runs.goto('/runs');
  const start = runs.getByRole('button', { name: 'Start a run' });
  if (await start.isVisible()) await start.click();
  const panel = runs.getByTestId('running-run');
  await expect(panel).toBeVisible();
  await panel.getByRole('button', { name: /^Take all of the/ }).first().click();
  await expect(panel.locator('h3:has-text("Sap in") + ul li').first()).not.toContainText('None yet');
  await expect(screen.getByRole('heading', { name: /Boiling now: run \d{4}-\d{3}/ })).toBeVisible({ timeout: 3_000 });

  await panel.getByLabel('Syrup (gal)').fill('1.5');
  await panel.getByLabel('Density (°Bx)').fill('67.1');
  await panel.getByLabel('Transmittance (%Tc)').fill('68');
  await expect(panel.getByTestId('draw-class')).toContainText('Amber Color');
  await panel.getByRole('button', { name: 'Record draw-off' }).click();
  await expect(panel.getByTestId('run-draws')).toContainText('1.50 gal');
  // 1.5 gal on the display across the room, within a second or two.
  await expect(screen.getByTestId('display-run-syrup')).toHaveText('1.50 gal', { timeout: 3_000 });
  await screen.screenshot({ path: '.tmp/screens/display-1920.png' });
  await runs.screenshot({ path: '.tmp/screens/runs-1024.png', fullPage: true });

  // The sugarmaker finishes the run (it is then split; a season with a run still boiling cannot close).
  await panel.getByRole('button', { name: 'Finish run', exact: true }).click();
  await panel.getByRole('button', { name: /^Yes, finish run \d{4}-\d{3}$/ }).click();
  await expect(runs.getByTestId('running-run')).toHaveCount(0);

  // Revoked: the page is gone.
  await coordinator.page.goto('/settings');
  await coordinator.page.getByRole('button', { name: 'Revoke Sugarhouse TV' }).first().click();
  await expect(coordinator.page.getByText('Revoked').first()).toBeVisible();
  const gone = await screen.goto(new URL(url).pathname);
  expect(gone?.status()).toBe(404);

  await tv.close();
  await coordinator.context.close();
});
