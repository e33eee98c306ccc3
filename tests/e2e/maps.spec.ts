import { expect, test, type Page } from '@playwright/test';
import { shot, signIn } from './helpers';

/** Every pin's box lies inside the map's box: the map was fitted to its pins when first drawn. */
async function expectPinsInside(page: Page, mapName: string) {
  const map = page.getByRole('group', { name: mapName });
  const box = (await map.boundingBox())!;
  const pins = map.getByTestId('map-pin');
  const n = await pins.count();
  expect(n).toBeGreaterThan(0);
  for (let i = 0; i < n; i++) {
    const p = (await pins.nth(i).boundingBox())!;
    expect(p.x).toBeGreaterThanOrEqual(box.x);
    expect(p.y).toBeGreaterThanOrEqual(box.y);
    expect(p.x + p.width).toBeLessThanOrEqual(box.x + box.width);
    expect(p.y + p.height).toBeLessThanOrEqual(box.y + box.height);
  }
  return n;
}

for (const width of [1280, 390]) {
  test(`recipients and drop-off maps draw the demo town under labelled pins, fitted to them (${width} px)`, async ({ page }) => {
    await page.setViewportSize({ width, height: 900 });
    await signIn(page, 'coordinator');

    await page.goto('/recipients');
    const map = page.getByRole('group', { name: 'Map of the recipients' });
    await expect(map).toBeVisible({ timeout: 20_000 });
    // The basemap: streets, river and parks as shapes, and the town's names written on it.
    await expect(map.locator('.leaflet-tile-pane path').first()).toBeVisible();
    expect(await map.locator('.leaflet-tile-pane path').count()).toBeGreaterThan(10);
    await expect(map.getByText('Thimbleford', { exact: true })).toBeVisible();
    await expect(map.getByText('Thimble Water')).toBeVisible();
    const n = await expectPinsInside(page, 'Map of the recipients');
    // Every pin is numbered, and the list under the map names each number.
    const legend = page.getByTestId('map-legend').first();
    await expect(legend.locator('li')).toHaveCount(n);
    await expect(legend).toContainText('Harbour Lantern Family Shelter');
    await expect(map.getByTestId('map-pin').first()).toHaveText('1');
    await shot(page, `map-recipients-${width}`);
    await map.screenshot({ path: `${process.env.SHOTS_DIR ?? 'test-results/shots'}/map-only-${width}.png` });

    await page.goto('/sites');
    await expect(page.getByRole('group', { name: 'Map of the drop-off sites' })).toBeVisible({ timeout: 20_000 });
    await expectPinsInside(page, 'Map of the drop-off sites');
    await expect(page.getByTestId('map-legend').first()).toContainText('Thimbleford Library');
    await shot(page, `map-sites-${width}`);
  });
}

test('a coordinator places a new recipient\'s pin by clicking the map', async ({ page }) => {
  await signIn(page, 'coordinator');
  await page.goto('/recipients/new');
  const map = page.getByRole('group', { name: "Map: click to place this recipient's pin" });
  await expect(map).toBeVisible({ timeout: 20_000 });
  // The map itself loads after the page: a click on its placeholder would place nothing.
  await expect(map.locator('.leaflet-container')).toBeVisible({ timeout: 20_000 });
  await expect(page.getByLabel('Latitude')).toHaveValue('');
  await map.scrollIntoViewIfNeeded();
  const box = (await map.boundingBox())!;
  await page.mouse.click(box.x + box.width * 0.6, box.y + box.height * 0.4);
  await expect(page.getByLabel('Latitude')).not.toHaveValue('');
  const lat = Number(await page.getByLabel('Latitude').inputValue());
  const lng = Number(await page.getByLabel('Longitude').inputValue());
  // Clicked a little north-east of the town's middle.
  expect(lat).toBeGreaterThan(46.2);
  expect(lng).toBeGreaterThan(-27.4);
  // The new pin is drawn in the accent colour among the other recipients' pins, and named.
  await expect(map.locator('.kl-pin-selected')).toHaveCount(1);
  await shot(page, 'map-place-pin');
});
