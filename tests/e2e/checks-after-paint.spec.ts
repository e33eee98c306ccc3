import { expect, test, type Page } from '@playwright/test';
import { signIn } from './helpers';

/**
 * Holds back every script that carries the schema library (zod), however the build names it, until
 * `release()`: what the page shows meanwhile is what a visitor sees before the checks arrive.
 */
async function holdSchemas(page: Page) {
  let release!: () => void;
  const gate = new Promise<void>((resolve) => (release = resolve));
  const held: string[] = [];
  await page.route('**/assets/*.js', async (route) => {
    const response = await route.fetch();
    const body = await response.text();
    if (body.includes('ZodError')) {
      held.push(route.request().url());
      await gate;
    }
    await route.fulfill({ response, body });
  });
  return { release, held };
}

test('the planner draws its plan before its checks load, and names a bad count once they have', async ({ page }) => {
  const schemas = await holdSchemas(page);
  await page.goto('/planner');
  await expect(page.getByTestId('plan-headline')).toContainText('111 stitches across × 103 rows');
  await expect(page.getByTestId('blanket-drawing')).toBeVisible();
  await expect.poll(() => schemas.held.length).toBeGreaterThan(0);

  await page.getByLabel('Stitches across').fill('12.5');
  await expect(page.getByText(/whole number/)).toHaveCount(0);
  schemas.release();
  await expect(page.getByText(/Stitches across must be a whole number/).first()).toBeVisible();
});

test('the blanket log works before its schema loads: a save waits for the checks, which then name what is missing', async ({ page }) => {
  await signIn(page, 'volunteer');
  const schemas = await holdSchemas(page);
  await page.goto('/blankets/new');
  await expect(page.getByRole('heading', { level: 1, name: 'Log a blanket' })).toBeVisible();
  await expect(page.getByTestId('self-check')).toContainText('Getting the check ready');
  await expect.poll(() => schemas.held.length).toBeGreaterThan(0);

  await page.getByLabel('Width (cm)').fill('80');
  await page.getByRole('button', { name: 'Save this blanket' }).click();
  await expect(page.getByText('Enter the length you measured')).toHaveCount(0);
  schemas.release();
  await expect(page.getByText('Enter the length you measured')).toBeVisible();
  await expect(page.getByText('Name at least one fibre')).toBeVisible();
  await expect(page.getByTestId('self-check')).toContainText('Fill in the length and the fibres');
  await expect(page).toHaveURL(/\/blankets\/new/);
});
