import { expect, test } from '@playwright/test';
import { shot, signIn } from './helpers';

test('an organiser reads the recipients, edits a guideline set and adds a need', async ({ page }) => {
  await signIn(page, 'organiser');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Recipients' }).click();
  await expect(page.getByRole('heading', { name: 'Recipients', level: 1 })).toBeVisible();
  await expect(page.getByRole('link', { name: 'Harbour Lantern Family Shelter' })).toBeVisible();
  await expect(page.getByRole('group', { name: 'Map of the recipients' }).getByTestId('map-pin')).toHaveCount(6);
  await shot(page, 'recipients-list');

  await page.getByRole('link', { name: 'Harbour Lantern Family Shelter' }).click();
  await expect(page.getByRole('heading', { name: 'Harbour Lantern Family Shelter', level: 1 })).toBeVisible();
  await expect(page.getByText('tummy time').first()).toBeVisible();
  await expect(page.getByTestId('facility-policy')).toBeVisible();

  // A need: 6 baby blankets, with a deadline.
  await page.getByRole('button', { name: 'Add a need' }).click();
  await page.getByLabel('How many').fill('0');
  await page.getByRole('button', { name: 'Add the need' }).click();
  await expect(page.getByText('Quantity must be at least 1')).toBeVisible();
  await page.getByLabel('How many').fill('6');
  await page.getByLabel('Wanted by').fill('2031-05-01');
  await page.getByLabel('Colours or style').fill('Soft greys');
  await page.getByRole('button', { name: 'Add the need' }).click();
  await expect(page.getByText('6 × baby blanket by')).toBeVisible();
  await shot(page, 'recipient-needs');

  // Guidelines: refuse nothing but fringe... then put the rest back from the defaults.
  await page.getByRole('tab', { name: 'Guidelines' }).click();
  await expect(page.getByText('What makers will read')).toBeVisible();
  await page.getByLabel('Largest width').fill('20');
  await expect(page.getByText(/must be at least the smallest width/)).toBeVisible();
  await expect(page.getByRole('button', { name: 'Save the guidelines' })).toBeDisabled();
  await page.getByLabel('Largest width').fill('95');
  await page.getByRole('checkbox', { name: '6 · super bulky' }).check();
  await expect(page.getByRole('region', { name: 'Summary for makers' })).toContainText('Yarn weights 1–6');
  await page.getByRole('button', { name: 'Save the guidelines' }).click();
  await expect(page.getByText('Guidelines saved.')).toBeVisible();
  await expect(page.getByLabel('Largest width')).toHaveValue('95');
  await shot(page, 'recipient-guidelines');

  await page.getByRole('tab', { name: 'Details and map' }).click();
  await expect(page.getByLabel('Contact e-mail')).toHaveValue('harbour.lantern@example.org');
  await page.getByLabel('Contact e-mail').fill('not an address');
  await page.getByRole('button', { name: 'Save the details' }).click();
  await expect(page.getByText('Contact e-mail: enter a valid e-mail address')).toBeVisible();
  await shot(page, 'recipient-details');
});

test('a coordinator adds a drop-off site by clicking the map', async ({ page }) => {
  await signIn(page, 'coordinator');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Sites' }).click();
  await expect(page.getByRole('heading', { name: 'Drop-off sites' })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Hollyhock Yarn Parlour' })).toBeVisible();
  await page.getByRole('button', { name: 'Add a site' }).click();
  await page.getByLabel('Name').fill('Orchard Rise Surgery');
  await page.getByLabel('Address').fill('8 Orchard Rise, Thimbleford');
  const siteMap = page.getByRole('group', { name: "Map: click to place the site's pin" });
  // The map itself loads after the page: a click on its placeholder would place nothing.
  await expect(siteMap.locator('.leaflet-container')).toBeVisible({ timeout: 20_000 });
  await siteMap.click({ position: { x: 120, y: 80 } });
  await expect(page.getByLabel('Latitude')).not.toHaveValue('');
  await page.getByRole('button', { name: 'Add the site' }).click();
  await expect(page.getByRole('heading', { name: 'Orchard Rise Surgery' })).toBeVisible();
  await shot(page, 'sites');
});

test('an organiser prints tags for blankets waiting at the library', async ({ page }) => {
  await signIn(page, 'organiser');
  await page.goto('/organiser/queue');
  await page.getByLabel('Drop-off site').selectOption({ label: 'Thimbleford Library' });
  const waiting = page.locator('section, div').filter({ has: page.getByRole('heading', { name: /Waiting for inspection/ }) }).last();
  const boxes = waiting.getByRole('checkbox');
  await expect(boxes.first()).toBeVisible();
  const count = await boxes.count();
  for (let i = 0; i < count; i++) await boxes.nth(i).check();
  await page.getByRole('link', { name: /Print \d+ tags?/ }).click();
  await expect(page.getByTestId('tag')).toHaveCount(count);
  await expect(page.getByTestId('tag').first().getByRole('img')).toBeVisible();
  await expect(page.getByTestId('tag').first()).toContainText(/KL-[2-9A-Z]{4}/);
  // Every blanket waiting at the library is for babies, so every tag carries the safe-sleep line.
  await expect(page.getByTestId('tag-infant-caution')).toHaveCount(count);
  await shot(page, 'tag-sheet');
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('button', { name: 'Print' })).toBeHidden();
  await shot(page, 'tag-sheet-print');
});
