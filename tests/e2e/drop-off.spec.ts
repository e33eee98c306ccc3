import { expect, test } from '@playwright/test';
import { shot, signIn, signOut } from './helpers';

/** A maker books a drop-off through the map, the coordinator finds the invitation, the organiser sees the visit. */
test('a maker books a drop-off on the map; the invitation arrives and the organiser sees the visit', async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1280, height: 900 });
  // A demo maker with a finished blanket and nothing booked yet.
  await signIn(page, 'ines@example.org');
  const me = (await (await page.request.get('/api/auth/me')).json()).user as { name: string };
  const mine = (await (await page.request.get('/api/blankets?status=finished')).json()).items as Array<{ id: number; code: string }>;
  const blanket = mine[0]!;

  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Drop-off' }).click();
  await expect(page.getByRole('heading', { name: 'Drop-off', level: 1 })).toBeVisible();
  await expect(page.getByText('Europe/London', { exact: true }).first()).toBeVisible();
  await expect(page.getByText('Nothing booked yet')).toBeVisible();
  await page.getByRole('checkbox', { name: new RegExp(blanket.code) }).check();

  // Choose the yarn shop on the map: its pin carries the next free time.
  const map = page.getByRole('group', { name: 'Map of the drop-off sites; choose one' });
  await expect(map.getByTestId('map-pin')).toHaveCount(3);
  await map.locator('[data-testid="map-pin"][data-label^="Hollyhock Yarn Parlour: next free"]').click();
  await expect(page.getByRole('button', { name: /Hollyhock Yarn Parlour/, pressed: true })).toBeVisible();
  const times = page.getByRole('list', { name: /^Times on / });
  const free = times.getByRole('button', { disabled: false }).first();
  await expect(free).toContainText('1 place left of 1');
  await free.click();
  await shot(page, 'drop-off-choose');
  await page.getByRole('button', { name: /^Book .* at Hollyhock Yarn Parlour$/ }).click();
  await expect(page.getByText(/^Booked: Hollyhock Yarn Parlour/)).toBeVisible();
  const booked = page.getByTestId('my-booking').filter({ hasText: blanket.code });
  await expect(booked).toBeVisible();
  await shot(page, 'drop-off-booked');

  const bookings = (await (await page.request.get('/api/bookings')).json()).bookings as Array<{ siteId: number; start: string; blankets: Array<{ code: string }> }>;
  const mineNow = bookings.find((b) => b.blankets.some((x) => x.code === blanket.code))!;

  // On a phone the page still reads top to bottom.
  await page.setViewportSize({ width: 390, height: 844 });
  await expect(booked).toBeVisible();
  await shot(page, 'drop-off-phone');
  await page.setViewportSize({ width: 1280, height: 900 });
  await signOut(page);

  // The confirmation with its calendar file reaches the mail page.
  await signIn(page, 'coordinator');
  await page.goto('/mail');
  const message = page.getByRole('list', { name: 'Messages' }).getByRole('button', { name: /Drop-off booked: Hollyhock Yarn Parlour/ });
  await expect(message).toBeVisible({ timeout: 30_000 });
  await message.click();
  const attachment = page.getByRole('list', { name: 'Attachments' }).getByRole('link', { name: 'drop-off.ics' });
  await expect(attachment).toBeVisible();
  await expect(attachment).toHaveAttribute('href', /BEGIN%3AVCALENDAR/);
  await shot(page, 'drop-off-mail');
  await signOut(page);

  // The organiser sees who is coming to the shop that day.
  await signIn(page, 'organiser');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Drop-off day' }).click();
  await page.getByLabel('Site').selectOption(String(mineNow.siteId));
  await page.getByLabel('Day', { exact: true }).fill(mineNow.start.slice(0, 10));
  const visit = page.getByTestId('day-booking').filter({ hasText: blanket.code });
  await expect(visit).toContainText(me.name);
  await expect(visit).toContainText('Expected');
  await shot(page, 'drop-off-day');
  await page.setViewportSize({ width: 390, height: 844 });
  await expect(visit).toBeVisible();
  await shot(page, 'drop-off-day-phone');
});

test('a coordinator edits a site\'s opening hours, visits per slot and closures', async ({ page }) => {
  await page.setViewportSize({ width: 1280, height: 900 });
  await signIn(page, 'coordinator');
  await page.goto('/sites');
  await page.getByRole('button', { name: 'Opening hours of Millrace Community Hall' }).click();
  const form = page.getByRole('form', { name: 'Opening hours of Millrace Community Hall' });
  await form.getByRole('button', { name: 'Add hours on Sunday' }).click();
  await form.getByLabel('Sunday span 1 opens').fill('11:00');
  await form.getByLabel('Sunday span 1 closes').fill('13:00');
  await form.getByLabel('Visits per slot').fill('5');
  await shot(page, 'sites-hours-editor');
  await form.getByRole('button', { name: 'Save the hours' }).click();
  const card = page.getByRole('listitem').filter({ hasText: 'Millrace Community Hall' });
  await expect(card.getByTestId('site-hours')).toContainText('Sun 11:00–13:00');
  await expect(card.getByTestId('site-hours')).toContainText('5 visits each');

  // Overlapping spans are refused with the reason, and nothing is lost.
  await page.getByRole('button', { name: 'Opening hours of Millrace Community Hall' }).click();
  await form.getByRole('button', { name: 'Add hours on Sunday' }).click();
  await form.getByLabel('Sunday span 2 opens').fill('12:00');
  await form.getByLabel('Sunday span 2 closes').fill('14:00');
  await form.getByRole('button', { name: 'Save the hours' }).click();
  await expect(form.getByRole('alert')).toContainText('overlap');
  await page.setViewportSize({ width: 390, height: 844 });
  await shot(page, 'sites-hours-phone');
});
