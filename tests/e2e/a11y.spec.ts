import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { signIn, type Who } from './helpers';

/**
 * WCAG 2.2 level A and AA rules as axe-core checks them (contrast, names, labels, landmarks...).
 * axe finds what a machine can; the pages were also looked at by eye.
 */
const TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

async function expectAccessible(page: Page, path: string) {
  await page.goto(path);
  await page.waitForLoadState('networkidle');
  await expect(page.locator('main h1').first()).toBeVisible();
  const { violations } = await new AxeBuilder({ page }).withTags(TAGS).analyze();
  const summary = violations.map((v) => `${v.id} (${v.impact}): ${v.help} — ${v.nodes.slice(0, 3).map((n) => n.target.join(' ')).join(' | ')}`);
  expect(summary, `accessibility problems on ${path}`).toEqual([]);
}

const publicPages = ['/', '/sign-in', '/register', '/forgot-password', '/planner', '/no-such-page'];
const signedInPages: Record<Who, string[]> = {
  volunteer: ['/home', '/needs', '/pledges', '/blankets', '/blankets/new', '/drop-off'],
  organiser: ['/home', '/organiser/intake', '/organiser/queue', '/organiser/drop-offs', '/all-blankets', '/recipients'],
  coordinator: ['/sites', '/people', '/mail', '/drive', '/all-pledges?promising=true'],
};

for (const path of publicPages) {
  test(`${path} meets WCAG 2.2 AA as axe checks it`, async ({ page }) => {
    await expectAccessible(page, path);
  });
}

for (const [who, paths] of Object.entries(signedInPages) as Array<[Who, string[]]>) {
  test(`${who} pages meet WCAG 2.2 AA as axe checks them`, async ({ page }) => {
    await signIn(page, who);
    for (const path of paths) await expectAccessible(page, path);
  });
}

test('detail pages (a blanket, a recipient, a blanket at intake) meet WCAG 2.2 AA as axe checks them', async ({ page }) => {
  await signIn(page, 'organiser');
  const blankets = (await (await page.request.get('/api/blankets?pageSize=100')).json()).items as Array<{ id: number; code: string; status: string }>;
  const recipients = (await (await page.request.get('/api/recipients')).json()).recipients as Array<{ id: number }>;
  const received = blankets.find((b) => b.status === 'received') ?? blankets[0]!;
  await expectAccessible(page, `/blankets/${blankets[0]!.id}`);
  await expectAccessible(page, `/recipients/${recipients[0]!.id}`);
  await expectAccessible(page, `/organiser/intake?code=${received.code}`);
});

test('the assignment board, with a suggestion open, meets WCAG 2.2 AA as axe checks it', async ({ page }) => {
  await signIn(page, 'organiser');
  await expectAccessible(page, '/organiser/assign');
  await page.getByRole('button', { name: 'Suggest assignments' }).click();
  await page.getByRole('button', { name: /Accept \d+ ticked/ }).waitFor();
  const { violations } = await new AxeBuilder({ page }).withTags(TAGS).analyze();
  expect(violations.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
});
