import { test, expect } from './fixtures';

const degrees = (text: string | null) => Number((text ?? '').replace(/[^\d.-]/g, ''));

test.describe('Sugarhouse: draw-off target from the finishing °Brix', () => {
  test('shows the target, how it moves across Grade A density, and the hydrometer readings, at 360 px without sideways scroll', async ({ page, signInAs }) => {
    await signInAs('sugarmaker@larkspur.example');
    await page.setViewportSize({ width: 360, height: 800 });
    await page.goto('/sugarhouse');
    const water = degrees(await page.getByTestId('water-boiling-point').textContent());
    const target = degrees(await page.getByTestId('draw-off-target').textContent());
    // The demo co-op works in °F: finished syrup boils about 7 °F above water (common practice).
    expect(Math.abs(target - water - 7)).toBeLessThanOrEqual(1);

    const rows = page.getByTestId('draw-off-table').locator('tbody tr');
    await expect(rows.first()).toContainText('66.0 °Bx');
    await expect(rows.last()).toContainText('68.9 °Bx');
    await expect(page.getByTestId('draw-off-table').locator('tr[aria-current="true"]')).toContainText('66.9 °Bx');
    const targets = await rows.locator('td:nth-child(2)').allTextContents();
    expect(targets.length).toBeGreaterThanOrEqual(7);
    for (let i = 1; i < targets.length; i++) expect(degrees(targets[i])).toBeGreaterThanOrEqual(degrees(targets[i - 1]));

    // Vermont density chart: 66.9 °Brix syrup reads 59.0 hot (209 °F and above) on a 60 °F hydrometer.
    await expect(page.getByTestId('hydrometer-readings')).toContainText('59.0 °Bx');
    await expect(page.getByRole('heading', { name: /Safety at the evaporator/ }).or(page.getByText('Safety at the evaporator'))).toBeVisible();
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360);

    // A barometer reading moves the target: a low-pressure day lowers it.
    await page.getByLabel('Unit').selectOption('kPa');
    await page.getByLabel('Barometer in the sugarhouse now').fill('95');
    await expect(page.getByTestId('draw-off-target')).not.toHaveText(`${target.toFixed(1)} °F`);
    expect(degrees(await page.getByTestId('draw-off-target').textContent())).toBeLessThan(target);
  });
});
