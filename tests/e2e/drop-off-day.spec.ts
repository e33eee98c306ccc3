import { expect, test, type Page } from '@playwright/test';
import { shot, signIn } from './helpers';

interface Visit {
  id: number;
  status: string;
  siteId: number;
  siteName: string;
  start: string;
  end: string;
  maker: { name: string };
  blankets: Array<{ code: string }>;
}

const csrf = async (page: Page) => (await (await page.request.get('/api/auth/csrf')).json()).csrfToken as string;

/** Sets the product clock of the test server (TEST_CLOCK), or gives it back to the real time with null. */
async function setClock(page: Page, now: string | null) {
  const res = await page.request.put('/api/drive/clock/now', { headers: { 'X-CSRF-Token': await csrf(page) }, data: { now } });
  expect(res.status(), await res.text()).toBe(200);
}

/** A demo visit still booked, from the site days of the coming two weeks. */
async function aBookedVisit(page: Page): Promise<Visit> {
  const clock = (await (await page.request.get('/api/drive/clock')).json()) as { today: string };
  const sites = (await (await page.request.get('/api/sites?active=true')).json()).sites as Array<{ id: number }>;
  for (let d = 1; d <= 16; d++) {
    const day = new Date(Date.parse(`${clock.today}T00:00:00Z`) + d * 86_400_000).toISOString().slice(0, 10);
    for (const s of sites) {
      const visits = (await (await page.request.get(`/api/bookings?siteId=${s.id}&day=${day}`)).json()).bookings as Visit[];
      const v = visits.find((x) => x.status === 'booked' && x.blankets.length > 0);
      if (v) return v;
    }
  }
  throw new Error('the demo has no booked visit in the coming two weeks');
}

test("the intake queue shows the day's booked arrivals; after the slot the organiser marks who did not come", async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1280, height: 900 });
  await signIn(page, 'coordinator');
  const visit = await aBookedVisit(page);
  try {
    // Ten minutes before the visit: the queue's day (the drive's today) is the visit's day.
    await setClock(page, new Date(Date.parse(visit.start) - 10 * 60_000).toISOString());
    await page.goto(`/organiser/queue?siteId=${visit.siteId}`);
    await expect(page.getByLabel('Day', { exact: true })).toHaveValue(visit.start.slice(0, 10));
    await expect(page.getByTestId('zone-note')).toContainText('Europe/London');
    const arrival = page.getByTestId('booked-arrival').filter({ hasText: visit.maker.name });
    await expect(arrival).toContainText(visit.start.slice(11, 16));
    await expect(arrival).toContainText(`${visit.blankets.length} blanket`);
    await expect(arrival).toContainText(visit.blankets[0].code);
    await expect(arrival).toContainText('Expected');
    await shot(page, 'intake-queue-booked');
    await page.setViewportSize({ width: 390, height: 844 });
    await expect(arrival).toBeVisible();
    await shot(page, 'intake-queue-booked-phone');
    await page.setViewportSize({ width: 1280, height: 900 });

    // Before the slot ends there is nothing to mark yet.
    await page.goto(`/organiser/drop-offs?siteId=${visit.siteId}&day=${visit.start.slice(0, 10)}`);
    const row = page.getByTestId('day-booking').filter({ hasText: visit.maker.name });
    await expect(row).toContainText('Expected');
    await expect(row.getByRole('button', { name: 'Did not come' })).toHaveCount(0);

    // A minute after the slot: the organiser marks that nobody came.
    await setClock(page, new Date(Date.parse(visit.end) + 60_000).toISOString());
    await page.reload();
    await expect(row).toContainText('Slot over, not received');
    await row.getByRole('button', { name: 'Did not come' }).click();
    await expect(page.getByRole('status').filter({ hasText: 'did not come' })).toBeVisible();
    await expect(row.getByText('Did not come', { exact: true })).toBeVisible();
    await expect(page.getByTestId('day-missed')).toContainText(visit.maker.name);
    await shot(page, 'drop-off-day-missed');
    await page.setViewportSize({ width: 390, height: 844 });
    await expect(page.getByTestId('day-missed')).toBeVisible();
    await shot(page, 'drop-off-day-missed-phone');
    await page.setViewportSize({ width: 1280, height: 900 });

    // The queue says so too, and the blankets are finished again for the maker to book.
    await page.goto(`/organiser/queue?siteId=${visit.siteId}`);
    await expect(page.getByTestId('booked-arrival').filter({ hasText: visit.maker.name })).toContainText('Did not come');
    const blanket = (await (await page.request.get(`/api/blankets?q=${visit.blankets[0].code}`)).json()).items as Array<{ code: string; status: string }>;
    expect(blanket.find((b) => b.code === visit.blankets[0].code)?.status).toBe('finished');
  } finally {
    await setClock(page, null);
  }
});

test("a coordinator sets the drive's time zone from the list of zones", async ({ page }) => {
  await page.setViewportSize({ width: 1280, height: 900 });
  await signIn(page, 'coordinator');
  await page.goto('/sites');
  const form = page.getByRole('form', { name: "The drive's time zone" });
  const zone = form.getByLabel('Time zone');
  await expect(zone).toHaveValue('Europe/London');
  expect(await zone.locator('option').count()).toBeGreaterThan(300);
  try {
    await zone.selectOption('America/New_York');
    await expect(form.getByText(/^Now there: /)).toBeVisible();
    await shot(page, 'sites-time-zone');
    await form.getByRole('button', { name: 'Save the time zone' }).click();
    await expect(page.getByText('The drive now runs on America/New_York time.')).toBeVisible();
    expect((await (await page.request.get('/api/drive/clock')).json()).timeZone).toBe('America/New_York');
    await page.goto('/organiser/drop-offs');
    await expect(page.getByText('America/New_York', { exact: true }).first()).toBeVisible();
    await page.goto('/sites');
    await page.setViewportSize({ width: 390, height: 844 });
    await shot(page, 'sites-time-zone-phone');
  } finally {
    const res = await page.request.put('/api/drive/clock', { headers: { 'X-CSRF-Token': await csrf(page) }, data: { timeZone: 'Europe/London' } });
    expect(res.status()).toBe(200);
  }
});

test('a maker turns the day-before reminders off and on again on the drop-off page', async ({ page }) => {
  await page.setViewportSize({ width: 1280, height: 900 });
  await signIn(page, 'volunteer');
  await page.goto('/drop-off');
  const toggle = page.getByRole('checkbox', { name: 'E-mail me a reminder the day before each drop-off' });
  await expect(toggle).toBeChecked();
  await toggle.click();
  await expect(toggle).not.toBeChecked();
  await expect.poll(async () => (await (await page.request.get('/api/bookings/reminders')).json()).bookingReminders).toBe(false);
  await page.reload();
  await expect(toggle).not.toBeChecked();
  await toggle.click();
  await expect(toggle).toBeChecked();
  await expect.poll(async () => (await (await page.request.get('/api/bookings/reminders')).json()).bookingReminders).toBe(true);
});
