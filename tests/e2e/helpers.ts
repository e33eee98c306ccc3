import { expect, type Page } from '@playwright/test';
import { E2E_PASSWORD } from './password';

export { E2E_PASSWORD };
export type Who = 'volunteer' | 'organiser' | 'coordinator';

export async function signIn(page: Page, who: Who | string, password = E2E_PASSWORD) {
  const email = who.includes('@') ? who : `${who}@example.org`;
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  // On a phone the name is folded away behind the menu: present, not necessarily visible.
  await expect(page.getByTestId('whoami')).toBeAttached();
}

export async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();
}

export async function shot(page: Page, name: string) {
  const dir = process.env.SHOTS_DIR ?? 'test-results/shots';
  await page.screenshot({ path: `${dir}/${name}.png`, fullPage: true });
}
