import { expect, test } from '@playwright/test';
import { shot, signIn } from './helpers';

for (const width of [1280, 390]) {
  test(`a maker sees what to fix on the blanket's page and prints its tag (${width} px)`, async ({ page }) => {
    await signIn(page, 'tobias@example.org');
    await page.setViewportSize({ width, height: 900 });
    await page.goto('/blankets');
    await expect(page.getByRole('heading', { level: 1, name: 'My blankets' })).toBeVisible();
    // The demo's blanket with a fringe came back from the table for a fix.
    const fringed = width > 800 ? page.getByTestId('blanket-row').filter({ hasText: 'cream fringe' }) : page.getByTestId('blanket-card').filter({ hasText: 'cream fringe' });
    await fringed.getByRole('link', { name: /^KL-/ }).click();

    const findings = page.getByRole('region', { name: 'What to put right' });
    await expect(findings).toBeVisible();
    await expect(findings).toContainText('Fringe on a baby blanket');
    // The self-check beside it says it is only part of the story, rather than a bare green tick.
    await expect(page.getByTestId('self-check-note')).toContainText('What to put right');
    await shot(page, `maker-needs-fix-${width}`);
    const pageWidth = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(pageWidth).toBeLessThanOrEqual(width);

    await page.getByRole('link', { name: 'Print its tag' }).first().click();
    await expect(page.getByRole('heading', { level: 1, name: 'Blanket tags' })).toBeVisible();
    await expect(page.getByTestId('tag')).toHaveCount(1);
    await shot(page, `maker-one-tag-${width}`);
  });
}

test('a maker prints several tags at once from My blankets, and a tag that is not theirs is refused in plain words', async ({ page }) => {
  await signIn(page, 'tobias@example.org');
  await page.goto('/blankets');
  const boxes = page.getByRole('checkbox', { name: /^Choose KL-.* to print its tag$/ });
  await expect(page.getByTestId('blanket-row').first()).toBeVisible();
  // One box per blanket on the page, each named after its blanket.
  const rows = await page.getByTestId('blanket-row').count();
  expect(rows).toBeGreaterThan(1);
  await expect(boxes).toHaveCount(rows);
  await boxes.nth(0).check();
  await boxes.nth(1).check();
  await expect(page.getByText('2 blankets chosen.')).toBeVisible();
  await shot(page, 'maker-choose-tags');
  await page.getByRole('link', { name: 'Print their 2 tags' }).click();
  await expect(page.getByTestId('tag')).toHaveCount(2);
  await shot(page, 'maker-two-tags');

  // A hand-edited link naming a blanket that is not theirs.
  const ids = new URL(page.url()).searchParams.get('ids')!;
  await page.goto(`/tags?ids=${ids},1`);
  const refusal = page.getByRole('alert');
  await expect(refusal).toContainText('We could not print these tags');
  await expect(refusal).toContainText('not among yours');
  await expect(refusal).not.toContainText('ids');
  await shot(page, 'maker-tag-refused');
  await page.goto('/tags?ids=1;2');
  await expect(page.getByText('No blankets chosen')).toBeVisible();
});

test('a pledge whose blanket was declined says so and still offers to log another', async ({ page }) => {
  await signIn(page, 'dev@example.org');
  await page.goto('/pledges');
  const pledge = page.getByRole('region', { name: /Kestrel Rise Hospice/ }).first();
  await expect(pledge).toContainText('1 declined at intake (not counted)');
  await expect(pledge.getByRole('link', { name: 'Log a blanket' })).toBeVisible();
  await shot(page, 'maker-declined-pledge');
});
