import fs from 'node:fs';
import { expect, test } from '@playwright/test';
import { shot, signIn } from './helpers';

test('a coordinator plans a run, exports the delivery list and marks a stop delivered', async ({ page }) => {
  await signIn(page, 'coordinator');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Delivery runs' }).click();
  await expect(page.getByRole('heading', { name: 'Delivery runs', level: 1 })).toBeVisible();
  await shot(page, 'delivery-runs-list');

  await page.getByRole('button', { name: 'Plan a run' }).first().click();
  const form = page.getByRole('form', { name: 'Plan a delivery run' });
  await form.getByLabel('Driver', { exact: true }).selectOption({ label: 'Odile Farrant' });
  await form.getByLabel(/Harbour Lantern Family Shelter/).check();
  await form.getByLabel(/Fernhollow House/).check();
  await shot(page, 'delivery-plan-form');
  await form.getByRole('button', { name: 'Plan this run' }).click();

  await expect(page.getByRole('heading', { name: /^Run of / })).toBeVisible();
  const stops = page.getByTestId('run-stop');
  await expect(stops).toHaveCount(2);
  await page.getByRole('button', { name: 'Suggest a stop order' }).click();
  await expect(page.getByText(/Round trip \d+\.\d km/)).toBeVisible();
  // Blankets for a family shelter with babies: the cautions and the facility's policy are shown.
  const shelter = stops.filter({ hasText: 'Harbour Lantern Family Shelter' });
  await expect(shelter.getByText('Safety first')).toBeVisible();
  await expect(shelter.getByTestId('facility-policy')).toBeVisible();

  const downloading = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Download the delivery list (CSV)' }).click();
  const download = await downloading;
  expect(download.suggestedFilename()).toMatch(/^kindloop-run-\d+-.*\.csv$/);
  const file = await download.path();
  const text = fs.readFileSync(file!, 'utf8');
  expect(text.charCodeAt(0)).toBe(0xfeff);
  expect(text).toContain('Run date,Stop,Recipient,Address,Box,Blanket code');
  expect(text).toContain('\r\n');
  expect(text).toContain('Harbour Lantern Family Shelter');
  await expect(page.getByText('Delivery list downloaded')).toBeVisible();

  await shelter.getByRole('button', { name: 'Mark packed' }).click();
  await expect(shelter.getByText('Packed', { exact: true })).toBeVisible();
  await shelter.getByLabel('Signed for by').fill('Shelter office');
  await shot(page, 'delivery-run-detail');
  await shelter.getByRole('button', { name: 'Mark delivered' }).click();
  await expect(shelter.getByText(/received, signed for by Shelter office/)).toBeVisible();

  await page.setViewportSize({ width: 390, height: 844 });
  await shot(page, 'delivery-run-detail-390');

  await page.setViewportSize({ width: 1280, height: 900 });
  await page.getByRole('link', { name: 'All runs' }).click();
  await page.getByRole('link', { name: 'Exports' }).click();
  await expect(page.getByRole('heading', { name: 'Exports', level: 1 })).toBeVisible();
  await expect(page.getByRole('row').nth(1)).toContainText('Delivery run of');
  await shot(page, 'delivery-exports');
  await page.setViewportSize({ width: 390, height: 844 });
  await shot(page, 'delivery-exports-390');
});

test('the organiser who drives a run can record its hand-overs; planning stays with the coordinator', async ({ page }) => {
  await signIn(page, 'organiser');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Delivery runs' }).click();
  await page.getByRole('link').filter({ hasText: 'Packed, ready to go' }).first().click();
  await expect(page.getByRole('heading', { name: /^Run of / })).toBeVisible();
  await expect(page.getByText(/Odile Farrant drives/)).toBeVisible();
  const packed = page.getByTestId('run-stop').filter({ has: page.getByText('Packed', { exact: true }) }).first();
  await expect(packed.getByLabel('Signed for by')).toBeVisible();
  await expect(packed.getByRole('button', { name: 'Mark delivered' })).toBeVisible();
  await expect(page.getByRole('button', { name: 'Suggest a stop order' })).toHaveCount(0);
  await shot(page, 'delivery-run-driver');
});
