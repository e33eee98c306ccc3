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
  await expect(page.getByRole('table', { name: 'Wanted, pledged and in hand per recipient' })).toBeAttached();
  await expect(page.getByRole('table', { name: 'Blankets by status' })).toContainText('Delivered');
  await shot(page, 'coordinator-progress');
});

test('makers see no staff charts on their home page', async ({ page }) => {
  await signIn(page, 'volunteer');
  await expect(page.getByRole('heading', { name: 'Where to go' })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'How the drive is going' })).toHaveCount(0);
});
