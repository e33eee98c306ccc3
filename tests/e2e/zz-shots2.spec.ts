import { test } from '@playwright/test';
import { signIn } from './helpers';

for (const width of [1280, 390]) {
  test(`drop-off shots ${width}`, async ({ page }) => {
    await page.setViewportSize({ width, height: 1000 });
    await signIn(page, 'volunteer');
    await page.goto('/drop-off');
    const box = page.getByText('E-mail me a thank-you saying where my blankets went');
    await box.waitFor();
    await box.scrollIntoViewIfNeeded();
    await page.evaluate(() => window.scrollBy(0, -300));
    await page.screenshot({ path: `/tmp/glance-shots/dropoff-${width}.png` });
  });
}
