import { expect, test } from '@playwright/test';
import { shot, signIn } from './helpers';

test('a coordinator sends a refused message again from the Mail page, and it goes out', async ({ page }) => {
  await signIn(page, 'coordinator');
  await page.goto('/mail');
  const unsent = page.getByRole('list', { name: 'Messages not sent yet' });
  // The demo holds one welcome note the mail server refused.
  const row = unsent.getByRole('listitem').filter({ hasText: 'to felix@example.org' });
  await expect(row).toBeVisible();
  await expect(row.getByText('Not sent')).toBeVisible();
  await expect(row.getByText(/Mail server said: 550/)).toBeVisible();
  await shot(page, 'mail-outbox-failed');
  await page.setViewportSize({ width: 390, height: 844 });
  await shot(page, 'mail-outbox-failed-phone');
  await page.setViewportSize({ width: 1280, height: 800 });

  await row.getByRole('button', { name: /Send again/ }).click();
  // Back in the queue, then handed to the local catcher by the worker within a few seconds.
  await expect(page.getByText('Everything has been sent.')).toBeVisible({ timeout: 20_000 });
  await expect(page.getByRole('list', { name: 'Messages' }).getByRole('button', { name: /Welcome to Kindloop.*to felix@example.org/ })).toBeVisible({ timeout: 20_000 });
});
