import { expect, test } from '@playwright/test';
import { shot, signIn } from './helpers';

test('an organiser sees every maker’s blankets, filters by status and opens one that waits for intake', async ({ page }) => {
  await signIn(page, 'organiser');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Blankets', exact: true }).click();
  await expect(page.getByRole('heading', { name: 'All blankets' })).toBeVisible();
  const table = page.getByRole('table');
  await expect(table.getByRole('columnheader', { name: /Maker/ })).toBeVisible();
  // The demo drive has blankets from more than one maker.
  const makers = await table.locator('tbody tr td:nth-child(2)').allInnerTexts();
  expect(new Set(makers).size).toBeGreaterThan(1);
  await shot(page, 'organiser-all-blankets');

  await page.getByLabel('Status', { exact: true }).selectOption('booked');
  const first = table.locator('tbody tr').first();
  await expect(first).toContainText('Drop-off booked');
  await first.getByRole('link').first().click();
  // Receiving happens at intake, where the re-measure and the check are recorded.
  await page.getByRole('link', { name: 'Receive or inspect at intake' }).click();
  await expect(page).toHaveURL(/\/organiser\/intake\?code=KL-/);
});
