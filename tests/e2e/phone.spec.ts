import { expect, test, type Page } from '@playwright/test';
import { shot, signIn, type Who } from './helpers';

const PHONE = { width: 390, height: 844 };
const DESKTOP = { width: 1280, height: 900 };

const pages: Record<Who | 'visitor', string[]> = {
  visitor: ['/', '/planner', '/sign-in', '/register', '/no-such-page'],
  volunteer: ['/home', '/needs', '/pledges', '/blankets', '/blankets/new'],
  organiser: ['/organiser/intake', '/organiser/queue', '/all-blankets', '/recipients'],
  coordinator: ['/people', '/sites', '/mail'],
};

/** The page is no wider than the screen, and names itself in the title. */
async function checkPage(page: Page, path: string, width: number): Promise<string> {
  await page.goto(path);
  await expect(page.locator('main h1').first()).toBeVisible({ timeout: 20_000 });
  await page.waitForLoadState('networkidle');
  const scrollWidth = await page.evaluate(() => document.documentElement.scrollWidth);
  expect(scrollWidth, `${path} at ${width} px is wider than the screen`).toBeLessThanOrEqual(width);
  await expect(page).toHaveTitle(/ · Kindloop$/);
  return page.title();
}

for (const size of [PHONE, DESKTOP]) {
  for (const [who, paths] of Object.entries(pages) as Array<[Who | 'visitor', string[]]>) {
    test(`${who}: the main pages fit ${size.width} px and each has its own title`, async ({ page }) => {
      await page.setViewportSize(size);
      if (who !== 'visitor') await signIn(page, who);
      const titles = new Set<string>();
      for (const path of paths) {
        titles.add(await checkPage(page, path, size.width));
        if (size === PHONE) await shot(page, `phone-${who}${path.replaceAll('/', '-')}`);
      }
      expect(titles.size, `every ${who} page has a title of its own`).toBe(paths.length);
    });
  }
}

test.describe('on a 390 px phone', () => {
  test.use({ viewport: PHONE });

  test('"Saved. Thank you!" reads as one paragraph and keeps the page its width', async ({ page }) => {
    await signIn(page, 'volunteer');
    await page.goto('/blankets');
    // On a phone the list is cards: open the first blanket by its code.
    await page.locator('main a[href^="/blankets/"]:not([href$="/new"])').filter({ visible: true }).first().click();
    await expect(page.locator('main h1')).toContainText('Blanket');
    // The page shows the banner when it is reached straight after logging (router state "logged").
    await page.evaluate(() => window.history.replaceState({ ...window.history.state, usr: { logged: true } }, ''));
    await page.reload();
    const banner = page.getByRole('status').filter({ hasText: 'Saved. Thank you!' });
    await expect(banner).toBeVisible();
    const text = banner.getByText(/on its tag/);
    const box = (await text.boundingBox())!;
    // Flowing text: wide as the banner allows, a handful of lines rather than a tall narrow column.
    expect(box.width).toBeGreaterThan(200);
    expect(box.height).toBeLessThan(8 * 30);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await shot(page, 'phone-saved-banner');
  });

  test('People shows whole names and role names, and pausing an account asks first', async ({ page }) => {
    await signIn(page, 'coordinator');
    await page.goto('/people');
    const cards = page.getByRole('list', { name: 'People and their roles' }).getByRole('listitem');
    await expect(cards.first()).toBeVisible();
    const first = cards.first();
    const name = first.locator('p').first();
    expect(await name.evaluate((el) => el.scrollWidth <= el.clientWidth)).toBe(true);
    const select = page.getByRole('combobox', { name: /^Role of / }).first();
    // A select this wide shows "Coordinator" whole at the 18 px base size.
    expect((await select.boundingBox())!.width).toBeGreaterThan(250);
    await shot(page, 'phone-people');

    const someone = cards.filter({ has: page.getByRole('button', { name: /^Pause / }) }).first();
    const who = (await someone.locator('p').first().textContent())!;
    const person = cards.filter({ hasText: who });
    await person.getByRole('button', { name: /^Pause / }).click();
    const confirm = person.getByTestId('pause-confirm');
    await expect(confirm).toContainText(`Pause ${who}?`);
    await expect(person.getByRole('button', { name: 'Keep it active' })).toBeFocused();
    await shot(page, 'phone-people-pause');
    await person.getByRole('button', { name: 'Keep it active' }).click();
    await expect(confirm).toHaveCount(0);
    await expect(person.getByText('Active', { exact: true })).toBeVisible();

    await person.getByRole('button', { name: /^Pause / }).click();
    await person.getByRole('button', { name: 'Pause the account' }).click();
    await expect(person.getByText('Paused', { exact: true })).toBeVisible();
    await person.getByRole('button', { name: /^Reactivate / }).click();
    await expect(person.getByText('Active', { exact: true })).toBeVisible();
  });

  test('a pledge form opened from a card takes the focus', async ({ page }) => {
    await signIn(page, 'volunteer');
    await page.goto('/needs');
    await page.getByRole('button', { name: /^Pledge for / }).first().click();
    await expect(page.getByLabel('How many')).toBeFocused();
    await shot(page, 'phone-pledge-form');
  });

  test('a focused text field shows a solid outline of at least 2 px, not only a border change', async ({ page }) => {
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').focus();
    await page.keyboard.press('Tab');
    await page.keyboard.press('Shift+Tab');
    const style = await page.getByLabel('E-mail').evaluate((el) => {
      const s = getComputedStyle(el);
      return { style: s.outlineStyle, width: parseFloat(s.outlineWidth), colour: s.outlineColor };
    });
    expect(style.style).toBe('solid');
    expect(style.width).toBeGreaterThanOrEqual(2);
    await shot(page, 'phone-focus');
  });
});
