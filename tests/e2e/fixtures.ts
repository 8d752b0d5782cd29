import { test as base, expect, type Page } from '@playwright/test';
import { DEMO_PASSWORD } from '../test-env';

/** The sign-in page as a person uses it. */
export class SignInPage {
  constructor(private readonly page: Page) {}

  async goto() {
    await this.page.goto('/sign-in');
  }

  async signIn(email: string, password = DEMO_PASSWORD) {
    await this.goto();
    await this.page.getByLabel('E-mail').fill(email);
    await this.page.getByLabel('Password').fill(password);
    await this.page.getByRole('button', { name: 'Sign in' }).click();
  }
}

/** Opens the "More" dialog of the signed-in navigation. */
export async function openMore(page: Page) {
  await page.getByRole('navigation', { name: 'Main' }).getByRole('button', { name: 'More' }).click();
  const dialog = page.getByRole('dialog', { name: 'More' });
  await expect(dialog).toBeVisible();
  return dialog;
}

/** Signs out through the "More" dialog. */
export async function signOutFrom(page: Page) {
  const dialog = await openMore(page);
  await dialog.getByRole('button', { name: 'Sign out' }).click();
  await expect(page).toHaveURL(/\/sign-in/);
}

interface Fixtures {
  signInPage: SignInPage;
  /** Signs in with a demo account and waits for the signed-in shell. */
  signInAs: (email: string) => Promise<void>;
}

export const test = base.extend<Fixtures>({
  signInPage: async ({ page }, use) => {
    await use(new SignInPage(page));
  },
  signInAs: async ({ page, signInPage }, use) => {
    await use(async (email: string) => {
      await signInPage.signIn(email);
      await expect(page.getByTestId('signed-in-as')).toBeVisible();
    });
  },
});

export { expect };
