import { expect, test, type Page } from '@playwright/test';
import { shot, signIn } from './helpers';

async function planThirtyByTwentyThree(page: Page) {
  await page.goto('/planner');
  await expect(page.getByRole('heading', { level: 1, name: 'Blanket planner' })).toBeVisible({ timeout: 20_000 });
  await page.getByLabel('Stitches across').fill('30');
  await page.getByLabel('Rows', { exact: true }).fill('23');
  await page.getByLabel('Just a count').check();
  // The library's border with a multiple of 4 plus 1.
  await page.getByLabel('Border pattern').selectOption('five-dc-shell');
  await page.getByLabel('Only add stitches').check();
  await page.getByLabel('Edge by edge').check();
}

test('a visitor plans 30 × 23 with a 4-plus-1 border and sees +3 / +2 and the drawing', async ({ page }) => {
  await planThirtyByTwentyThree(page);
  await expect(page.getByTestId('border-details')).toContainText('multiple of 4 plus 1');

  // Worked check values (common practice, done by hand): 30 → 33 and 23 → 25.
  const plan = page.getByTestId('edge-plan');
  await expect(page.getByTestId('sentence-top')).toContainText('+3');
  await expect(page.getByTestId('sentence-top')).toContainText('3 extra stitches, 33 in all');
  await expect(page.getByTestId('sentence-bottom')).toContainText('3 extra stitches, 33 in all');
  await expect(page.getByTestId('sentence-right')).toContainText('+2');
  await expect(page.getByTestId('sentence-right')).toContainText('2 extra stitches, 25 in all');
  await expect(page.getByTestId('sentence-left')).toContainText('2 extra stitches, 25 in all');
  await expect(plan).toContainText('work 2 hdc in the 7th, 15th and 23rd stitch');

  const drawing = page.getByTestId('blanket-drawing');
  await expect(drawing).toBeVisible();
  // One mark per stitch that takes an extra stitch: 3 on top, 3 on the bottom, 2 on each side.
  await expect(drawing.getByTestId('foundation-mark')).toHaveCount(10);
  await expect(drawing.locator('[data-testid="foundation-mark"][data-edge="top"]')).toHaveCount(3);
  await expect(drawing.locator('[data-testid="foundation-mark"][data-edge="right"]')).toHaveCount(2);
  await expect(drawing.locator('[data-testid="foundation-mark"][data-kind="skip"]')).toHaveCount(0);
  // 33 + 25 + 33 + 25 stitches and 12 corner stitches: 32 shells, one centred on each corner.
  await expect(drawing.getByTestId('border-repeat')).toHaveCount(32);
  await expect(drawing.locator('[data-testid="corner-mark"][data-centred="true"]')).toHaveCount(4);
  await expect(page.getByTestId('corner-plan')).toContainText('A repeat is centred on the corner');

  // UK terms rewrite the stitch names, not the numbers.
  await page.getByLabel('UK terms').check();
  await expect(plan).toContainText('work 2 htr in the 7th, 15th and 23rd stitch');
  await page.getByLabel('US terms').check();

  await page.setViewportSize({ width: 1280, height: 900 });
  await shot(page, 'planner-1280');
  await page.setViewportSize({ width: 375, height: 800 });
  await shot(page, 'planner-375');
});

test("'fewest changes' skips where that is shorter, and the drawing marks the skip", async ({ page }) => {
  await planThirtyByTwentyThree(page);
  await page.getByLabel('Fewest changes').check();
  await expect(page.getByTestId('sentence-top')).toContainText('skip the 15th stitch');
  const drawing = page.getByTestId('blanket-drawing');
  await expect(drawing.locator('[data-testid="foundation-mark"][data-kind="skip"]')).toHaveCount(2);
  await expect(drawing.locator('[data-testid="foundation-mark"][data-kind="add"]')).toHaveCount(4);
});

test('bad counts are named and nothing typed is lost', async ({ page }) => {
  await page.goto('/planner');
  await page.getByLabel('Stitches across').fill('2500');
  await expect(page.getByText('Stitches across over 2,000 stitches is too large to plan').first()).toBeVisible();
  await expect(page.getByLabel('Stitches across')).toHaveValue('2500');
  await expect(page.getByTestId('blanket-drawing')).toHaveCount(0);
  await page.getByLabel('Stitches across').fill('64');
  await expect(page.getByTestId('blanket-drawing')).toBeVisible();
});

test('an open border shows the caution for babies, and the tables are there to open', async ({ page }) => {
  await page.goto('/planner');
  await page.getByLabel('Border pattern').selectOption('open-v-lattice');
  await expect(page.getByTestId('safety-notes')).toContainText("receiving facility's own policy decides");
  await page.getByLabel('This blanket is for a baby or a premature baby').check();
  await expect(page.getByTestId('safety-notes')).toContainText('firm, bare surface');
  await page.getByTestId('yarn-weight-table').locator('summary').click();
  await expect(page.getByTestId('yarn-weight-table')).toContainText('Craft Yarn Council');
  await expect(page.getByTestId('yarn-result')).toContainText('10 % spare');
});

test('a visitor is asked to sign in to save', async ({ page }) => {
  await page.goto('/planner');
  await expect(page.getByRole('link', { name: 'Sign in to save' })).toBeVisible();
});

test('a signed-in volunteer saves a plan, sees it listed and loads it back', async ({ page }) => {
  await signIn(page, 'volunteer');
  await planThirtyByTwentyThree(page);
  await page.getByLabel('Name for this plan').fill('Shell edge for the ward');
  await page.getByRole('button', { name: 'Save plan' }).click();
  await expect(page.getByText('"Shell edge for the ward" is in your plans below')).toBeVisible();
  const list = page.getByTestId('saved-plans');
  await expect(list).toContainText('Shell edge for the ward');
  await expect(list).toContainText('Five-dc shell · 30 × 23 rows · top and bottom +3, sides +2');

  await page.getByRole('button', { name: 'Start again' }).click();
  // Starting again takes the counts the example swatch and size call for.
  await expect(page.getByLabel('Stitches across')).toHaveValue('111');
  await page.getByRole('button', { name: 'Load Shell edge for the ward' }).click();
  await expect(page.getByText('Loaded your plan "Shell edge for the ward"')).toBeVisible();
  await expect(page.getByLabel('Stitches across')).toHaveValue('30');
  await expect(page.getByTestId('sentence-right')).toContainText('25 in all');
  await page.setViewportSize({ width: 1280, height: 900 });
  await shot(page, 'planner-saved-1280');
});

test('one continuous round moves the first repeat so more corners get a centred repeat, and says where to begin', async ({ page }) => {
  await page.goto('/planner');
  await page.getByLabel('Stitches across').fill('20');
  await page.getByLabel('Rows', { exact: true }).fill('20');
  await page.getByLabel('Just a count').check();
  await page.getByLabel('Border pattern').selectOption('wide-scallop');
  await page.getByLabel('One continuous round').check();
  // Begun where the pattern usually begins, no corner would get a centred scallop; two stitches on, all four do.
  await expect(page.getByText(/Begin the first repeat after 2 stitches of the top edge rather than 1/)).toBeVisible();
  await expect(page.getByTestId('blanket-drawing').locator('[data-testid="corner-mark"][data-centred="true"]')).toHaveCount(4);
  await shot(page, 'planner-continuous');
});

test('the plan, the yarn estimate and the printed plan use the counts the swatch panel gives for 80 × 100 cm', async ({ page }) => {
  await page.goto('/planner');
  await expect(page.getByTestId('gauge-result')).toContainText('Start with 111 stitches and 103 rows');
  await expect(page.getByLabel('Stitches across')).toHaveValue('111');
  await expect(page.getByLabel('Rows', { exact: true })).toHaveValue('103');
  await expect(page.getByTestId('counts-in-use')).toContainText('use these counts');
  await expect(page.getByTestId('yarn-counts')).toContainText("For the plan's 111 stitches × 103 rows");

  // Counts typed by the maker are kept, and the page says the size and yarn follow them, not the target.
  await page.getByLabel('Stitches across').fill('42');
  await expect(page.getByTestId('finished-size')).toContainText('Your plan uses your own counts');
  await expect(page.getByTestId('yarn-counts')).toContainText("For the plan's 42 stitches × 103 rows");
  await page.getByRole('button', { name: 'Use 111 stitches and 103 rows in the plan' }).click();
  await expect(page.getByLabel('Stitches across')).toHaveValue('111');

  await page.emulateMedia({ media: 'print' });
  await expect(page.getByTestId('plan-headline')).toContainText('111 stitches across × 103 rows');
  await expect(page.getByTestId('gauge-panel')).toContainText('Counts in this plan: 111 stitches × 103 rows, from the swatch and the target size');
  await expect(page.getByTestId('yarn-counts')).toBeVisible();
  await shot(page, 'planner-print');
});
