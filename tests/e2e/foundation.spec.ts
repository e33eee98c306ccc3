import { expect, test, type Page } from '@playwright/test';
import { E2E_PASSWORD, shot, signIn, signOut } from './helpers';

const navFor = {
  volunteer: { has: ['Home', 'Planner'], lacks: ['People', 'Mail', 'At a glance'] },
  organiser: { has: ['Home', 'Planner', 'At a glance'], lacks: ['People', 'Mail'] },
  coordinator: { has: ['Home', 'Planner', 'At a glance', 'People', 'Mail'], lacks: [] as string[] },
} as const;

test('the public home page explains the drive', async ({ page }) => {
  await page.goto('/');
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Thimbleford');
  await expect(page.getByRole('heading', { name: 'How the drive works' })).toBeVisible();
  await shot(page, 'public-home');
});

for (const role of ['volunteer', 'organiser', 'coordinator'] as const) {
  test(`a ${role} signs in, sees their own navigation and signs out`, async ({ page }) => {
    await signIn(page, role);
    const nav = page.getByRole('navigation', { name: 'Main' });
    for (const label of navFor[role].has) await expect(nav.getByRole('link', { name: label, exact: true })).toBeVisible();
    for (const label of navFor[role].lacks) await expect(nav.getByRole('link', { name: label, exact: true })).toHaveCount(0);
    await expect(page.getByRole('heading', { level: 1 })).toContainText('Hello');
    await shot(page, `home-${role}`);
    await signOut(page);
  });
}

test('a new maker registers and lands on their home page', async ({ page }) => {
  await page.goto('/register');
  await page.getByLabel('Your name').fill('Juniper Testmaker');
  await page.getByLabel('E-mail').fill('juniper@example.org');
  await page.getByLabel('Password').fill('a comfortable passphrase');
  await page.getByRole('button', { name: 'Create my account' }).click();
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Hello, Juniper');
  await expect(page.getByTestId('whoami')).toContainText('Maker');
});

test('registration names what is wrong', async ({ page }) => {
  await page.goto('/register');
  await page.getByLabel('E-mail').fill('not-an-address');
  await page.getByLabel('Password').fill('short');
  await page.getByRole('button', { name: 'Create my account' }).click();
  await expect(page.getByText('Tell us your name')).toBeVisible();
  await expect(page.getByText('Enter a valid e-mail address')).toBeVisible();
  await expect(page.getByText('Use at least 15 characters; a few words in a row work well')).toBeVisible();
});

/** Links already handed out by `resetLinkFor`: each works once, and a newer request replaces an older one. */
const spent = new Set<string>();

/**
 * Asks for a reset link for `email` and reads it on the Mail page as `reader`, who must be its addressee.
 * Messages are listed newest first; the one carrying a link not seen before is this request's.
 */
async function resetLinkFor(page: Page, reader: Page, email: string): Promise<string> {
  await reader.goto('/mail');
  await expect(reader.getByRole('heading', { name: 'Mail', level: 1 })).toBeVisible();
  const mine = reader.getByRole('list', { name: 'Messages' }).getByRole('button', { name: new RegExp(`Reset your Kindloop password.*to ${email}`) });
  await page.goto('/forgot-password');
  await page.getByLabel('E-mail').fill(email);
  await page.getByRole('button', { name: 'Send the link' }).click();
  await expect(page.getByText('Check your inbox')).toBeVisible();
  let fresh = '';
  await expect(async () => {
    await reader.reload();
    await expect(mine.first()).toBeVisible({ timeout: 2_000 });
    // The list can still shift as the unsent list above it loads: the newest must be the one open.
    await mine.first().click();
    await expect(mine.first()).toHaveAttribute('aria-current', 'true', { timeout: 1_000 });
    const href = await reader.getByRole('link', { name: /reset-password\?token=/ }).first().getAttribute('href', { timeout: 2_000 });
    expect(href && !spent.has(href), 'a link not handed out before').toBe(true);
    fresh = href!;
  }).toPass({ timeout: 30_000 });
  spent.add(fresh);
  return new URL(fresh).pathname + new URL(fresh).search;
}

async function setPassword(page: Page, path: string, password: string) {
  await page.goto(path);
  await page.getByLabel('New password').fill(password);
  await page.getByLabel('The same again').fill(password);
  await page.getByRole('button', { name: 'Save the new password' }).click();
  await expect(page.getByText('Your password is changed')).toBeVisible();
}

test("the Mail page hides a maker's reset link from the coordinator and says why", async ({ page, browser }) => {
  await page.goto('/forgot-password');
  await page.getByLabel('E-mail').fill('maren@example.org');
  await page.getByRole('button', { name: 'Send the link' }).click();
  await expect(page.getByText('Check your inbox')).toBeVisible();

  const coord = await browser.newPage();
  await signIn(coord, 'coordinator');
  await coord.goto('/mail');
  await expect(coord.getByText('Reset links are for their owner only')).toBeVisible();
  const message = coord.getByRole('list', { name: 'Messages' }).getByRole('button', { name: /Reset your Kindloop password.*to maren@example.org/ }).first();
  await expect(message).toBeVisible({ timeout: 20_000 });
  await message.click();
  await expect(coord.getByText(/single-use link hidden/).first()).toBeVisible();
  await expect(coord.getByText(/only maren@example.org can use it/)).toBeVisible();
  await expect(coord.getByRole('link', { name: /token=/ })).toHaveCount(0);
  await expect(coord.getByText(/token=/)).toHaveCount(0);
  await shot(coord, 'coordinator-mail');
  await coord.setViewportSize({ width: 390, height: 844 });
  await shot(coord, 'coordinator-mail-phone');
  await coord.close();
});

test('a coordinator resets their own password through the link only they can see', async ({ page, browser }) => {
  const coord = await browser.newPage();
  await signIn(coord, 'coordinator');
  const first = await resetLinkFor(page, coord, 'coordinator@example.org');
  await setPassword(page, first, 'my new winter passphrase');
  await signIn(page, 'coordinator', 'my new winter passphrase');
  await signOut(page);
  // The old password no longer works.
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('coordinator@example.org');
  await page.getByLabel('Password').fill(E2E_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByText('Wrong e-mail or password')).toBeVisible();

  // The reset signed the coordinator out everywhere; back in with the new one, put the usual one back
  // for the browser tests that follow.
  await signIn(coord, 'coordinator', 'my new winter passphrase');
  const second = await resetLinkFor(page, coord, 'coordinator@example.org');
  await setPassword(page, second, E2E_PASSWORD);
  await coord.close();
  await signIn(page, 'coordinator');
});

test('an unknown address shows the not-found page', async ({ page }) => {
  await page.goto('/no/such/page');
  await expect(page.getByRole('heading', { name: "We can't find that page" })).toBeVisible();
});

test('a volunteer opening a coordinator page is told it is for another role', async ({ page }) => {
  await signIn(page, 'volunteer');
  await page.goto('/people');
  await expect(page.getByRole('heading', { name: 'This page is for another role' })).toBeVisible();
});

test('a signed-out visitor to a private page is sent to sign in and back', async ({ page }) => {
  await page.goto('/people');
  await expect(page).toHaveURL(/sign-in\?next=%2Fpeople/);
  await page.getByLabel('E-mail').fill('coordinator@example.org');
  await page.getByLabel('Password').fill(E2E_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'People' })).toBeVisible();
});
