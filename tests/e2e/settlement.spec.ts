// This spec closes and settles the demo co-op's open season, after which no lot or run can be
// added to it. Playwright runs the spec files in name order on one worker, and every spec that
// logs lots or runs (deliveries, queue, calendar) sorts before this one; keep it that way.
import { test, expect } from './fixtures';
import { clearMail, waitForMail } from '../mailbox';

test.describe('settling the season', () => {
  test('coordinator closes and settles; the member gets the statement, pays on the checkout page and sees it paid', async ({ page, browser, signInAs }) => {
    test.setTimeout(240_000);
    await clearMail();

    // The coordinator: the ledger shows both splits, then close and settle.
    await signInAs('coordinator@larkspur.example');
    await page.goto('/ledger');
    await expect(page.getByRole('heading', { name: 'Season ledger' })).toBeVisible();
    await expect(page.getByRole('heading', { name: 'By sugar' })).toBeVisible();
    await expect(page.getByRole('heading', { name: 'By volume, for comparison' })).toBeVisible();
    await expect(page.getByTestId('ledger-row-Okafor')).toBeVisible();
    await expect(page.getByTestId('volume-row-Okafor')).toBeVisible();
    // A run's split is fetched when the run is opened: its households, each with its syrup.
    const firstRun = page.locator('section[aria-labelledby="runs"] details').first();
    await expect(firstRun.getByRole('table')).toHaveCount(0);
    await firstRun.locator('summary').click();
    await expect(firstRun.getByRole('rowheader').first()).toBeVisible();
    expect(await firstRun.getByRole('rowheader').count()).toBeGreaterThan(0);
    // The chart's library loads when its box comes into view, then draws the weeks.
    const chart = page.getByRole('img', { name: /Sugar delivered per week by household/ });
    await chart.scrollIntoViewIfNeeded();
    await expect(chart.locator('svg.recharts-surface').first()).toBeVisible();
    await page.screenshot({ path: '.tmp/screens/ledger-desktop.png', fullPage: true });

    // A season fee for one household: a wrong amount is refused at the field, a right one shows in its row.
    const fees = page.getByRole('form', { name: 'Season fees' });
    await fees.getByLabel('Household', { exact: true }).selectOption({ label: 'Okafor' });
    await fees.getByLabel('Fee (USD)').fill('thirty');
    await fees.getByRole('button', { name: 'Save fee' }).click();
    await expect(fees.getByLabel('Fee (USD)')).toHaveAttribute('aria-invalid', 'true');
    await fees.getByLabel('Fee (USD)').fill('35');
    await fees.getByRole('button', { name: 'Save fee' }).click();
    await expect(fees.getByText('The Okafor household’s fee is saved.')).toBeVisible();
    await expect(page.getByTestId('ledger-row-Okafor')).toContainText('$35.00');

    await page.getByRole('button', { name: 'Close the season' }).click();
    await expect(page.getByRole('status')).toContainText('The season is closed');
    await page.getByRole('button', { name: 'Settle and send statements' }).click();
    await expect(page.getByRole('status')).toContainText('statements queued');

    // The member's statement e-mail: figures, the PDF and the pay link.
    const mail = await waitForMail({ to: 'okafor@larkspur.example', subject: 'statement for the Okafor household', timeoutMs: 60_000 });
    expect(mail.text).toMatch(/Total due: \$[\d,]+\.\d{2}/);
    expect(mail.text).toMatch(/Syrup owed: [\d.]+ gal/);
    expect(mail.attachments?.some((a) => a.contentType === 'application/pdf')).toBe(true);
    const payLink = /https?:\/\/\S+\/statements\/[0-9a-f-]+\/pay/.exec(mail.text)![0];

    // The member follows the pay link, pays on the payment service's page, and sees it paid.
    const context = await browser.newContext();
    const member = await context.newPage();
    await member.goto('/sign-in');
    await member.getByLabel('E-mail').fill('okafor@larkspur.example');
    await member.getByLabel('Password').fill('syrup-season');
    await member.getByRole('button', { name: 'Sign in' }).click();
    await expect(member.getByTestId('signed-in-as')).toBeVisible();
    await member.goto(payLink);
    await expect(member.getByRole('heading', { name: /^Pay \$/ })).toBeVisible();
    await member.getByRole('button', { name: /^Pay \$/ }).click();
    await expect(member).toHaveURL(/\/statements\/[0-9a-f-]+\?paid=1/);
    await expect(member.getByTestId('statement-status')).toHaveText('Paid');

    // The member's ledger: its own row by sugar and by volume, nobody else's figures.
    await member.setViewportSize({ width: 360, height: 800 });
    await member.goto('/ledger');
    await expect(member.getByTestId('ledger-row-Okafor')).toBeVisible();
    await expect(member.getByTestId('volume-row-Okafor')).toBeVisible();
    await expect(member.getByTestId('ledger-row-Lindqvist')).toHaveCount(0);
    await member.screenshot({ path: '.tmp/screens/ledger-phone.png', fullPage: true });
    await context.close();
  });
});
