import { readFileSync } from 'node:fs';
import Papa from 'papaparse';
import type { Page } from '@playwright/test';
import { expect, test, SignInPage } from './fixtures';
import { clearMail, waitForMail } from '../mailbox';
import { gallonsToLitres, sugarKg, syrupLitres } from '../../lib/sugar';
import { showMass, showSyrup } from '../../lib/figures';

// A tablet at the sap tank, in portrait.
test.use({ viewport: { width: 820, height: 1180 }, hasTouch: true });
// Whole flows through a busy form; the machine may be shared.
test.describe.configure({ timeout: 180_000 });

/** A 1×1 PNG, as a tablet camera's file would be an image. */
const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8DwHwAFBQIAX8jx0gAAAABJRU5ErkJggg==', 'base64');

const form = (page: Page) => page.getByRole('form', { name: 'Log a sap drop-off' });

async function fillLot(page: Page, { household, gallons, brix, tempF }: { household: string; gallons: string; brix: string; tempF: string }) {
  const f = form(page);
  await f.getByLabel('Find a household by name').fill(household.slice(0, 4));
  await expect(f.getByRole('radio', { name: household })).toBeChecked();
  await f.getByLabel('Metered volume (gal)').fill(gallons);
  await f.getByLabel('Sugar content (°Bx)').fill(brix);
  await f.getByLabel('Sap temperature (°F)').fill(tempF);
}

test('a sugarmaker logs a lot with a photo and the live figures, and the household sees it', async ({ page, signInAs, browser }) => {
  await signInAs('sugarmaker@larkspur.example');
  await page.goto('/deliveries');
  await expect(page.getByRole('heading', { name: 'Drop-off desk' })).toBeVisible();
  await expect(form(page).getByRole('radio', { name: 'Clear' })).toBeChecked();

  const note = `e2e photo lot ${Date.now()}`;
  await fillLot(page, { household: 'Nakamura', gallons: '52.5', brix: '2.4', tempF: '37' });
  // The preview follows lib/sugar for 52.5 gal of 2.4 °Bx sap, in the co-op's US units.
  const litres = gallonsToLitres(52.5);
  await expect(page.getByTestId('preview-sugar')).toHaveText(showMass(sugarKg(litres, 2.4), 'us'));
  await expect(page.getByTestId('preview-syrup')).toHaveText(showSyrup(syrupLitres(litres, 2.4, 66.9), 'us'));
  await expect(page.getByTestId('preview-hours')).toHaveText(/^\d+\.\d h$/);
  await expect(page.getByTestId('preview-deadline')).not.toHaveText('—');
  await expect(page.getByTestId('recommendation')).toHaveText('Recommended: accept.');

  await form(page).getByLabel('Take or choose a photo').setInputFiles({ name: 'lot.png', mimeType: 'image/png', buffer: PNG });
  await expect(form(page).getByRole('img', { name: 'The photo attached to this lot' })).toBeVisible();
  await form(page).getByLabel('Note (optional)').fill(note);
  await page.getByRole('button', { name: 'Accept and log lot' }).click();
  await expect(page.getByText('Lot logged for the Nakamura household')).toBeVisible();
  // The form is empty again for the next household.
  await expect(form(page).getByLabel('Metered volume (gal)')).toHaveValue('');

  const row = page.getByTestId('lot-row').filter({ hasText: 'Nakamura' }).filter({ hasText: '52.5 gal' });
  await expect(row).toHaveCount(1);
  await expect(row).toContainText('2.4 °Bx');
  await expect(row).toContainText('Accepted');

  // The household's member sees the lot, with its photo, on "Our drop-offs".
  const memberContext = await browser.newContext({ viewport: { width: 820, height: 1180 } });
  const member = await memberContext.newPage();
  await new SignInPage(member).signIn('nakamura@larkspur.example');
  await expect(member.getByTestId('signed-in-as')).toBeVisible();
  await member.goto('/deliveries');
  await expect(member.getByRole('heading', { name: 'Our drop-offs' })).toBeVisible();
  await expect(member.getByRole('heading', { name: 'Drop-off desk' })).toHaveCount(0);
  const memberRow = member.getByTestId('lot-row').filter({ hasText: '52.5 gal' });
  await expect(memberRow).toHaveCount(1);
  await memberRow.getByRole('button', { name: /Details/ }).click();
  const dialog = member.getByRole('dialog');
  await expect(dialog).toContainText(note);
  const img = dialog.getByRole('img', { name: /Photo of the lot/ });
  await expect(img).toBeVisible();
  await expect.poll(() => img.evaluate((el: HTMLImageElement) => el.complete && el.naturalWidth)).toBe(1);
  await memberContext.close();
});

test('a cloudy lot is recommended for rejection, kept with its reason, and the household is e-mailed', async ({ page, signInAs }) => {
  await clearMail();
  await signInAs('sugarmaker@larkspur.example');
  await page.goto('/deliveries');
  await fillLot(page, { household: 'Szabo', gallons: '31', brix: '1.9', tempF: '39' });
  await form(page).getByText('Cloudy', { exact: true }).click();
  await expect(page.getByTestId('recommendation')).toHaveText(/Recommended: reject\. cloudy sap/);
  const reason = 'Cloudy and milky; the cans were left in the sun.';
  await form(page).getByLabel('Reason for rejecting').fill(reason);
  await page.getByRole('button', { name: 'Reject and log lot' }).click();
  await expect(page.getByText('Rejected lot logged for the Szabo household')).toBeVisible();

  const row = page.getByTestId('lot-row').filter({ hasText: 'Szabo' }).filter({ hasText: reason });
  await expect(row).toHaveCount(1);
  await expect(row).toContainText('Rejected');
  await expect(row).toContainText('not counted');

  const mail = await waitForMail({ to: 'szabo@larkspur.example', subject: 'Sap drop-off not accepted' });
  expect(mail.text).toContain(reason);
  // The lot's figures as the desk's table shows them.
  await expect(row).toContainText('31.0');
  expect(mail.text).toContain('Lot: 31.0 gal at 1.9 °Bx, 39.0 °F at the tank');
});

test('a double-click on submit makes one lot, and a failed submit keeps what was typed', async ({ page, signInAs }) => {
  await signInAs('sugarmaker@larkspur.example');
  await page.goto('/deliveries');
  const note = `e2e double ${Date.now()}`;
  await fillLot(page, { household: 'Ferreira', gallons: '44.4', brix: '2.8', tempF: '36' });
  await form(page).getByLabel('Note (optional)').fill(note);

  // The first try fails on the way (a dropped connection): nothing is lost.
  await page.route('**/api/deliveries', (route) => (route.request().method() === 'POST' ? route.abort('connectionreset') : route.fallback()), { times: 1 });
  await page.getByRole('button', { name: 'Accept and log lot' }).click();
  await expect(page.getByText('Everything you typed is still here')).toBeVisible();
  await expect(form(page).getByLabel('Metered volume (gal)')).toHaveValue('44.4');
  await expect(form(page).getByLabel('Note (optional)')).toHaveValue(note);
  await expect(form(page).getByRole('radio', { name: 'Ferreira' })).toBeChecked();

  await page.getByRole('button', { name: 'Accept and log lot' }).dblclick();
  await expect(page.getByText('Lot logged for the Ferreira household')).toBeVisible();
  const lots = (await (await page.request.get('/api/deliveries')).json()) as { note: string | null }[];
  expect(lots.filter((l) => l.note === note)).toHaveLength(1);
});

test('the CSV export downloads the lots the filters show, with the totals row over them', async ({ page, signInAs }) => {
  await signInAs('coordinator@larkspur.example');
  await page.goto('/deliveries');
  await page.getByLabel('Household', { exact: true }).selectOption({ label: 'Okafor' });
  const rows = page.getByTestId('lot-row');
  await expect(rows.first()).toContainText('Okafor');
  await expect.poll(async () => (await rows.allInnerTexts()).every((t) => t.includes('Okafor'))).toBe(true);
  const ids = await rows.evaluateAll((els) => els.map((e) => e.getAttribute('data-lot-id')));
  expect(ids.length).toBeGreaterThan(3);
  await expect(page.getByTestId('lot-totals')).toContainText(`${ids.length} lots`);

  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download CSV' }).click()]);
  expect(download.suggestedFilename()).toMatch(/^drop-offs-.*\.csv$/);
  const text = readFileSync((await download.path())!, 'utf8').replace(/^\ufeff/, '');
  const parsed = Papa.parse<Record<string, string>>(text.trim(), { header: true });
  expect(parsed.data.map((r) => r['Lot id'])).toEqual(ids);
  expect(parsed.data.every((r) => r.Household === 'Okafor')).toBe(true);
  expect(parsed.meta.fields).toEqual(expect.arrayContaining(['Volume (gal)', 'Volume (L)', '°Brix', 'Sugar (lb)', 'Status', 'Reason']));
});
