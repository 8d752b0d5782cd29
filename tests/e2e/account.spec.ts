import { test, expect } from './fixtures';
import { clearMail, waitForMail } from '../mailbox';

test('a member asks for a password reset; the link sets a new password once and is refused the second time', async ({ page }) => {
  await clearMail();
  await page.goto('/sign-in');
  await page.getByRole('link', { name: 'Forgot your password?' }).click();
  await expect(page).toHaveURL(/\/forgot-password$/);
  await page.getByLabel('E-mail').fill('szabo@larkspur.example');
  await page.getByRole('button', { name: 'Send the link' }).click();
  await expect(page.getByText('If that address has a Brixhouse account')).toBeVisible();

  const mail = await waitForMail({ to: 'szabo@larkspur.example', subject: 'new Brixhouse password' });
  const link = mail.text.match(/http\S+\/reset-password\/\S+/)![0];

  await page.goto(link);
  await page.getByLabel('New password').fill('first-run-of-spring');
  await page.getByLabel('The same password again').fill('first-run-of-spring');
  await page.getByRole('button', { name: 'Save password' }).click();
  await expect(page).toHaveURL(/\/sign-in\?reset=1/);
  await expect(page.getByText('Password saved')).toBeVisible();
  await page.getByLabel('E-mail').fill('szabo@larkspur.example');
  await page.getByLabel('Password').fill('first-run-of-spring');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByTestId('signed-in-as')).toBeVisible();

  // The same link a second time.
  await page.context().clearCookies();
  await page.goto(link);
  await page.getByLabel('New password').fill('second-try-at-this');
  await page.getByLabel('The same password again').fill('second-try-at-this');
  await page.getByRole('button', { name: 'Save password' }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'expired or was already used' })).toBeVisible();
  await expect(page).toHaveURL(/\/reset-password\//);
});

test('a sign-in link carrying callbackUrl=/%5Cevil.example ends on a Brixhouse page', async ({ page, baseURL }) => {
  await page.goto('/sign-in?callbackUrl=/%5Cevil.example');
  await page.getByLabel('E-mail').fill('nakamura@larkspur.example');
  await page.getByLabel('Password').fill('syrup-season');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByTestId('signed-in-as')).toBeVisible();
  expect(new URL(page.url()).origin).toBe(new URL(baseURL!).origin);
  await expect(page).toHaveURL(/\/home$/);
});

test('a person changes their name on the account page', async ({ page, signInAs }) => {
  await signInAs('brennan@larkspur.example');
  await page.goto('/account');
  await page.getByLabel('Name', { exact: true }).fill('Fintan Ó Brennan');
  await page.getByRole('button', { name: 'Save name' }).click();
  await expect(page.getByTestId('signed-in-as')).toHaveText('Fintan Ó Brennan');
});
