import { expect, test } from '@playwright/test';
import { shot, signIn } from './helpers';

test('a coordinator opens the drive at a glance and follows a figure to the list behind it', async ({ page }) => {
  await page.setViewportSize({ width: 1280, height: 900 });
  await signIn(page, 'coordinator');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'At a glance' }).click();
  await expect(page.getByRole('heading', { name: 'The drive at a glance', level: 1 })).toBeVisible();

  // The rule for a need at risk is stated on the page, and the chart loads with its figures as a table.
  await expect(page.getByText(/A need is at risk when its deadline is 21 days away or less/)).toBeVisible();
  await expect(page.getByTestId('chart-timeline').locator('.recharts-line').first()).toBeVisible();
  await page.getByText('The figures week by week, as a table').click();
  await expect(page.getByRole('table', { name: 'Blankets pledged, and blankets that reached each step, each week' })).toBeVisible();
  await expect(page.getByRole('table', { name: 'Blankets now at each step, per open need' })).toBeVisible();
  await shot(page, 'drive-glance-1280');

  // The "checked" tile opens the blanket list with that step, holding as many blankets as the tile said.
  const tile = page.getByTestId('tile-checked');
  const figure = Number((await tile.locator('span').first().textContent())!.trim());
  expect(figure).toBeGreaterThan(0);
  await tile.click();
  await expect(page).toHaveURL(/\/all-blankets\?step=checked$/);
  await expect(page.getByTestId('list-filter')).toContainText('checked now');
  await expect(page.getByText(`${figure} matching blanket${figure === 1 ? '' : 's'}`)).toBeVisible();

  // A figure of one need opens that need's blankets at that step.
  await page.getByRole('link', { name: 'Back to the drive at a glance' }).click();
  const cell = page.getByRole('link', { name: /^\d+ checked for / }).first();
  const label = (await cell.getAttribute('aria-label'))!;
  const n = Number(label.split(' ')[0]);
  await cell.click();
  await expect(page).toHaveURL(/\/all-blankets\?step=checked&needId=\d+$/);
  await expect(page.getByTestId('list-filter')).toContainText(label.replace(/^\d+ checked for /, ''));
  await expect(page.getByText(`${n} matching blanket${n === 1 ? '' : 's'}`)).toBeVisible();

  // A need's pledged figure opens its pledges still standing, promising as many blankets.
  await page.getByRole('link', { name: 'Back to the drive at a glance' }).click();
  const pledgedCell = page.getByRole('link', { name: /^\d+ pledged for / }).first();
  const pledgedN = Number((await pledgedCell.getAttribute('aria-label'))!.split(' ')[0]);
  await pledgedCell.click();
  await expect(page).toHaveURL(/\/all-pledges\?promising=true&needId=\d+$/);
  await expect(page.getByTestId('pledge-total')).toContainText(`promising ${pledgedN} blanket`);

  // Week by week for one need: a week's figure opens the blankets of that need that reached the step that week.
  await page.getByRole('link', { name: 'Back to the drive at a glance' }).click();
  const whose = page.getByLabel('Show the weeks of');
  await whose.selectOption({ index: 1 });
  const needLabel = (await whose.locator('option:checked').textContent())!;
  await page.getByText('The figures week by week, as a table').click();
  await expect(page.getByRole('table', { name: `Blankets pledged, and blankets that reached each step, each week for ${needLabel}` })).toBeVisible();
  const week = page.getByRole('link', { name: new RegExp(`^\\d+ (finished|received|checked|assigned|packed|delivered) in the week of .* for ${needLabel.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}$`) }).first();
  const weekN = Number((await week.getAttribute('aria-label'))!.split(' ')[0]);
  await week.click();
  await expect(page).toHaveURL(/\/all-blankets\?reached=\w+&from=[\d-]+&to=[\d-]+&needId=\d+$/);
  await expect(page.getByText(`${weekN} matching blanket${weekN === 1 ? '' : 's'}`)).toBeVisible();
});

test('on a phone the drive at a glance fits the width', async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await signIn(page, 'coordinator');
  await page.goto('/drive');
  await expect(page.getByRole('heading', { name: 'The drive at a glance', level: 1 })).toBeVisible();
  await expect(page.getByTestId('chart-timeline').locator('.recharts-line').first()).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await shot(page, 'drive-glance-390');
});

test("the drive at a glance is for staff: a maker is told it is for another role", async ({ page }) => {
  await signIn(page, 'volunteer');
  await page.goto('/drive');
  await expect(page.getByRole('heading', { name: 'This page is for another role' })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'The drive at a glance' })).toHaveCount(0);
});
