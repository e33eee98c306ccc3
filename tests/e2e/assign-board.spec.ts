import { expect, test, type Page } from '@playwright/test';
import { shot, signIn } from './helpers';

/** The story "an organiser assigns blankets to recipients": by hand, from the suggestion, and back. */

async function waitingCount(page: Page): Promise<number> {
  const text = (await page.getByRole('heading', { name: /Checked and waiting/ }).textContent()) ?? '';
  return Number(/\((\d+)\)/.exec(text)?.[1] ?? NaN);
}

test('an organiser assigns blankets to recipients: one by hand, part of a suggestion, and takes one back', async ({ page }) => {
  await page.setViewportSize({ width: 1280, height: 900 });
  await signIn(page, 'organiser');
  await page.getByRole('link', { name: 'Assign' }).first().click();
  await expect(page.getByRole('heading', { name: 'Assignment board' })).toBeVisible();
  await expect(page.getByRole('heading', { name: /Open needs/ })).toBeVisible();
  await expect.poll(() => waitingCount(page)).toBeGreaterThan(20);
  const before = await waitingCount(page);
  await shot(page, 'assign-board');

  // By hand: the first waiting blanket that fits something goes to the first need it fits.
  const row = page.locator('[data-testid^="waiting-"]').filter({ has: page.getByRole('button', { name: 'Assign' }) }).first();
  const code = ((await row.getAttribute('data-testid')) ?? '').replace('waiting-', '');
  const select = row.getByLabel(`Assign ${code} to`);
  const firstFit = await select.locator('option:not([disabled])').nth(1).getAttribute('value');
  await select.selectOption(firstFit!);
  await row.getByRole('button', { name: 'Assign' }).click();
  await expect(page.getByTestId(`waiting-${code}`)).toHaveCount(0);
  await expect.poll(() => waitingCount(page)).toBe(before - 1);

  // The suggestion: review it, keep three pairs, accept them in one batch.
  await page.getByRole('button', { name: 'Suggest assignments' }).click();
  const review = page.getByRole('region', { name: /Suggested: \d+ blankets? placed/ }).or(page.locator('[aria-labelledby="suggestion-title"]'));
  await expect(review).toBeVisible();
  await expect(review.getByText(/Needs left short/)).toBeVisible();
  await expect(review.getByText(/Blankets left over/)).toBeVisible();
  await review.getByText(/Blankets left over/).click();
  await expect(review.getByText(/No open need takes it as it is/).first()).toBeVisible();
  await shot(page, 'assign-suggestion');
  await review.getByRole('button', { name: 'Untick all' }).click();
  await expect(review.getByRole('button', { name: 'Accept 0 ticked' })).toBeDisabled();
  const pairs = review.getByRole('list', { name: 'Suggested pairs' }).getByRole('checkbox');
  for (let i = 0; i < 3; i++) await pairs.nth(i).check();
  await review.getByRole('button', { name: 'Accept 3 ticked' }).click();
  await expect(page.getByText('3 blankets assigned.')).toBeVisible();
  await shot(page, 'assign-accepted');
  await page.getByRole('button', { name: 'Back to the board' }).click();
  await expect.poll(() => waitingCount(page)).toBe(before - 4);

  // Take one back: the need's list of assigned blankets, a reason, and it waits again.
  const need = page.getByTestId(`need-${firstFit}`);
  await need.getByRole('button', { name: /Show the \d+ assigned/ }).click();
  const assigned = need.getByRole('list', { name: /Assigned to/ }).getByRole('listitem').filter({ hasText: code });
  await assigned.getByLabel(/Why unassign/).fill('The unit asked us to hold it for the spring');
  await assigned.getByRole('button', { name: 'Unassign' }).click();
  await expect.poll(() => waitingCount(page)).toBe(before - 3);
  await shot(page, 'assign-after-unassign');
});

test('the board works on a phone', async ({ page }) => {
  await signIn(page, 'organiser');
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto('/organiser/assign');
  await expect(page.getByRole('heading', { name: 'Assignment board' })).toBeVisible();
  await expect(page.locator('[data-testid^="waiting-"]').first()).toBeVisible();
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(0);
  await shot(page, 'assign-board-phone');
  const dir = process.env.SHOTS_DIR ?? 'test-results/shots';
  await page.screenshot({ path: `${dir}/assign-board-phone-top.png` });
  await page.locator('[data-testid^="waiting-"]').first().scrollIntoViewIfNeeded();
  await page.screenshot({ path: `${dir}/assign-board-phone-waiting.png` });
});
