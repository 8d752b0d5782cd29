import { test, expect, openMore, signOutFrom } from './fixtures';
import { clearMail, waitForMail } from '../mailbox';

type Page = import('@playwright/test').Page;
const dailyNames = async (page: Page) =>
  page.getByRole('navigation', { name: 'Main' }).getByRole('link').evaluateAll((els) => els.map((e) => (e as HTMLElement).innerText.trim()));
const moreNames = async (page: Page) => {
  const dialog = await openMore(page);
  const names = await dialog.getByRole('link').evaluateAll((els) => els.map((e) => (e as HTMLElement).innerText.trim()));
  await page.keyboard.press('Escape');
  return names;
};

test.describe('signing in by role', () => {
  test('a member sees the member navigation and is turned away from coordinator pages', async ({ page, signInAs }) => {
    await signInAs('okafor@larkspur.example');
    await expect(page).toHaveURL(/\/home$/);
    expect(await dailyNames(page)).toEqual(['Boil calendar', 'Our drop-offs', 'Boil queue', 'Season ledger']);
    expect(await moreNames(page)).toEqual(['Today', 'Your account']);
    await expect(page.getByText('Member', { exact: true })).toBeVisible();
    await page.goto('/households');
    await expect(page).toHaveURL(/\/not-allowed$/);
    await expect(page.getByRole('heading', { name: 'That page is not for your role' })).toBeVisible();
    const api = await page.request.get('/api/households');
    expect(api.status()).toBe(403);
  });

  test('a sugarmaker sees the sugarmaker navigation', async ({ page, signInAs }) => {
    await signInAs('sugarmaker@larkspur.example');
    expect(await dailyNames(page)).toEqual(['Boil calendar', 'Drop-off desk', 'Boil queue', 'Season ledger']);
    expect(await moreNames(page)).toEqual(['Today', 'Runs', 'Sugarhouse', 'Your account']);
    await page.goto('/households');
    await expect(page).toHaveURL(/\/not-allowed$/);
  });

  test('a coordinator sees every page', async ({ page, signInAs }) => {
    await signInAs('coordinator@larkspur.example');
    expect(await dailyNames(page)).toEqual(['Boil calendar', 'Drop-off desk', 'Boil queue', 'Season ledger']);
    expect(await moreNames(page)).toEqual(['Today', 'Runs', 'Households', 'Sugarhouse', 'Settings', 'Your account']);
    await (await openMore(page)).getByRole('link', { name: 'Households' }).click();
    await expect(page.getByRole('heading', { name: 'Households', level: 1 })).toBeVisible();
    await expect(page.getByRole('cell', { name: 'Tremblay-Haddad', exact: true })).toBeVisible();
  });

  test('a wrong password gets a clear message and no session', async ({ page, signInPage }) => {
    await signInPage.signIn('okafor@larkspur.example', 'pancakes-please');
    await expect(page.getByRole('alert').first()).toContainText('do not match an account');
    await expect(page).toHaveURL(/\/sign-in/);
    const cookies = await page.context().cookies();
    expect(cookies.some((c) => c.name.endsWith('next-auth.session-token'))).toBe(false);
    await page.goto('/home');
    await expect(page).toHaveURL(/\/sign-in/);
  });

  test('sign-out ends the session', async ({ page, signInAs }) => {
    await signInAs('lindqvist@larkspur.example');
    await signOutFrom(page);
    await page.goto('/home');
    await expect(page).toHaveURL(/\/sign-in/);
    expect((await page.request.get('/api/seasons')).status()).toBe(401);
  });
});

test('a coordinator adds a person and the welcome e-mail arrives', async ({ page, signInAs }) => {
  await clearMail();
  await signInAs('coordinator@larkspur.example');
  await page.goto('/households');
  const form = page.getByRole('form', { name: 'Add a person' });
  await form.getByLabel('Name').fill('Tova Lindqvist');
  await form.getByLabel('E-mail').fill('tova@larkspur.example');
  await form.getByLabel('Role').selectOption('member');
  await form.getByLabel('Household').selectOption({ label: 'Lindqvist' });
  await form.getByRole('button', { name: /Add person/ }).click();
  await expect(page.getByRole('cell', { name: 'tova@larkspur.example' })).toBeVisible();
  const mail = await waitForMail({ to: 'tova@larkspur.example', subject: 'Welcome to Larkspur Hollow Sugar Cooperative' });
  expect(mail.text).toContain('Tova Lindqvist');
  const link = mail.text.match(/http\S+\/welcome\/\S+/)![0];

  // The new member chooses a password from the link and signs in.
  await signOutFrom(page);
  await page.goto(link);
  await page.getByLabel('New password').fill('tapping-the-sugarbush');
  await page.getByLabel('The same password again').fill('tapping-the-sugarbush');
  await page.getByRole('button', { name: 'Save password' }).click();
  await expect(page).toHaveURL(/\/sign-in/);
  await expect(page.getByText('Password saved')).toBeVisible();
  await page.getByLabel('E-mail').fill('tova@larkspur.example');
  await page.getByLabel('Password').fill('tapping-the-sugarbush');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByTestId('signed-in-as')).toHaveText('Tova Lindqvist');
});

test('the add-person form marks the fields the server refuses', async ({ page, signInAs }) => {
  await signInAs('coordinator@larkspur.example');
  await page.goto('/households');
  const form = page.getByRole('form', { name: 'Add a person' });
  await form.getByLabel('Name').fill('Copy Cat');
  await form.getByLabel('E-mail').fill('okafor@larkspur.example');
  await form.getByLabel('Role').selectOption('sugarmaker');
  await form.getByRole('button', { name: /Add person/ }).click();
  await expect(form.getByText('This e-mail address is already in use.')).toBeVisible();
  await expect(form.getByLabel('E-mail')).toHaveAttribute('aria-invalid', 'true');
});

test('a coordinator changes a person’s role from the table', async ({ page, signInAs }) => {
  await signInAs('coordinator@larkspur.example');
  await page.goto('/households');
  const role = page.getByLabel('Role of Juno Varga');
  await expect(role).toHaveValue('sugarmaker');
  await role.selectOption('coordinator');
  await page.getByRole('button', { name: 'Save role' }).click();
  await expect(page.locator('[data-sonner-toast]', { hasText: 'Juno Varga is now coordinator.' })).toBeVisible();
  await page.reload();
  await expect(page.getByLabel('Role of Juno Varga')).toHaveValue('coordinator');

  // The last coordinator cannot step down: the table says why.
  await page.getByLabel('Role of Juno Varga').selectOption('sugarmaker');
  await page.getByRole('button', { name: 'Save role' }).click();
  await expect(page.locator('[data-sonner-toast]', { hasText: 'Juno Varga is now sugarmaker.' })).toBeVisible();
  const mine = page.getByLabel('Role of Wren Castellan');
  await page.reload();
  await mine.selectOption('sugarmaker');
  await page.getByRole('button', { name: 'Save role' }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'last coordinator' })).toBeVisible();
});
