import { expect, test } from '@playwright/test';
import { shot, signIn } from './helpers';

test('the coordinator’s home charts wanted, pledged and in hand per recipient, and where the blankets are', async ({ page }) => {
  await signIn(page, 'coordinator');
  await expect(page.getByRole('heading', { name: 'How the drive is going' })).toBeVisible();
  const recipients = page.getByTestId('chart-recipients');
  const statuses = page.getByTestId('chart-statuses');
  await expect(recipients.locator('.recharts-bar-rectangle').first()).toBeVisible();
  await expect(statuses.locator('.recharts-bar-rectangle').first()).toBeVisible();
  // The same figures are there for screen readers.
  await expect(page.getByRole('table', { name: 'Wanted, pledged, in hand and assigned per recipient' })).toBeAttached();
  await expect(page.getByRole('table', { name: 'Blankets by status' })).toContainText('Delivered');
  await shot(page, 'coordinator-progress');
});

test('makers see no staff charts on their home page', async ({ page }) => {
  await signIn(page, 'volunteer');
  await expect(page.getByRole('heading', { name: 'Where to go' })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'How the drive is going' })).toHaveCount(0);
});

test('a maker’s home shows what they promised, finished and handed in', async ({ page }) => {
  await signIn(page, 'volunteer');
  const part = page.getByRole('heading', { name: 'Your part' }).locator('xpath=ancestor::div[contains(@class,"rounded-2xl")][1]');
  await expect(part).toContainText(/\d+ promised · \d+ finished · \d+ handed in/);
  await expect(part.getByRole('progressbar', { name: 'Blankets finished of those you promised' })).toBeVisible();
  await shot(page, 'volunteer-home-part');
});

test('on a phone the menu button opens the same navigation', async ({ page }) => {
  await page.setViewportSize({ width: 375, height: 800 });
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('organiser@example.org');
  await page.getByLabel('Password').fill((await import('./password')).E2E_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('button', { name: 'Menu' }).click();
  await page.locator('#mobile-nav').getByRole('link', { name: 'Intake' }).click();
  await expect(page.getByRole('heading', { name: 'Intake', level: 1 })).toBeVisible();
  await expect(page.locator('#mobile-nav')).toHaveCount(0);
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(375);
});
