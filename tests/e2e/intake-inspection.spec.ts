import { expect, request, test, type Page } from '@playwright/test';
import { E2E_PASSWORD, shot, signIn } from './helpers';

/**
 * A maker logs a finished crib blanket for the family shelter through the API (the log's own
 * browser test covers that screen); the organiser then does the whole intake in the browser.
 */
async function logFinishedCribBlanket(baseURL: string, features: string[]): Promise<string> {
  const api = await request.newContext({ baseURL });
  const csrf = async () => (await (await api.get('/api/auth/csrf')).json()).csrfToken as string;
  const login = await api.post('/api/auth/login', { headers: { 'X-CSRF-Token': await csrf() }, data: { email: 'samir@example.org', password: E2E_PASSWORD } });
  expect(login.ok()).toBeTruthy();
  // A fresh one-blanket pledge each time, so every test has a pledge with room left.
  const needs = (await (await api.get('/api/needs')).json()).needs as Array<{ id: number; sizeCategory: string; recipient: { kind: string } }>;
  const need = needs.find((n) => n.sizeCategory === 'crib' && n.recipient.kind === 'family-shelter');
  expect(need, 'the demo family shelter wants crib blankets').toBeTruthy();
  const due = new Date(Date.now() + 20 * 86_400_000).toISOString().slice(0, 10);
  const pledged = await api.post('/api/pledges', {
    headers: { 'X-CSRF-Token': await csrf() },
    data: { needId: need!.id, quantity: 1, sizeCategory: 'crib', dueDate: due },
  });
  expect(pledged.status(), await pledged.text()).toBe(201);
  const pledge = (await pledged.json()).pledge as { id: number };
  const res = await api.post('/api/blankets', {
    headers: { 'X-CSRF-Token': await csrf() },
    data: {
      pledgeId: pledge!.id,
      status: 'finished',
      widthCm: 85,
      lengthCm: 105,
      yarnWeight: 4,
      fibres: ['acrylic'],
      features,
      colours: 'apricot and cream',
      bodyStitch: 'hdc',
      machineWashable: true,
      dryerSafe: true,
      smokeFree: true,
      petFree: true,
    },
  });
  expect(res.status(), await res.text()).toBe(201);
  const { code } = await res.json();
  await api.dispose();
  return code as string;
}

async function findAndReceive(page: Page, code: string) {
  await page.goto('/organiser/intake');
  await page.getByLabel('Blanket code').fill(code.toLowerCase());
  await page.getByRole('button', { name: 'Find' }).click();
  await expect(page.getByTestId('blanket-code')).toHaveText(code);
  await expect(page.getByText('No drop-off was booked for this one')).toBeVisible();
  await page.getByLabel('Drop-off site').selectOption({ label: 'Millrace Community Hall' });
  await page.getByLabel('Measured width (cm)').fill('84');
  await page.getByRole('button', { name: 'Receive it here' }).click();
  await expect(page.getByRole('heading', { name: 'Inspect it' })).toBeVisible();
  await expect(page.getByText('Received').first()).toBeVisible();
}

test('an organiser takes a blanket from received to checked', async ({ page, baseURL }) => {
  const code = await logFinishedCribBlanket(baseURL!, []);
  await signIn(page, 'organiser');
  await findAndReceive(page, code);

  // Until every question is answered there is no suggestion to follow.
  await expect(page.getByText('Answer the six questions above')).toBeVisible();
  await page.getByRole('button', { name: 'All six are fine' }).click();
  await expect(page.getByTestId('verdict')).toHaveText('Ready to go');
  await expect(page.getByTestId('suggestion')).toContainText('Checked, ready to go');
  // Going to babies: the infant cautions and the facility-policy line are on the page.
  await expect(page.getByText('tummy time').first()).toBeVisible();
  await expect(page.getByTestId('facility-policy').first()).toBeVisible();
  await shot(page, 'intake-inspect-ready');

  await page.getByRole('button', { name: /Record: checked/ }).click();
  await expect(page.getByText('It passed the check and is ready to be assigned.')).toBeVisible();
  const history = page.getByRole('list', { name: 'History' });
  await expect(history).toContainText('Received');
  await expect(history).toContainText('measured 84 × 105 cm');
  await expect(history).toContainText('Checked');
  await expect(history).toContainText('Odile Farrant');
  await shot(page, 'intake-checked');

  // The queue for the hall shows it among today's arrivals and inspections.
  await page.getByRole('link', { name: "Today's queue" }).click();
  await page.getByLabel('Drop-off site').selectOption({ label: 'Millrace Community Hall' });
  await expect(page.getByRole('link', { name: code }).first()).toBeVisible();
  await shot(page, 'intake-queue');
});

test('a fringed blanket for babies fails the check and is sent to the children\'s ward instead', async ({ page, baseURL }) => {
  const code = await logFinishedCribBlanket(baseURL!, ['fringe']);
  await signIn(page, 'organiser');
  await findAndReceive(page, code);

  await page.getByRole('button', { name: 'All six are fine' }).click();
  const result = page.getByTestId('check-result');
  await page.setViewportSize({ width: 390, height: 844 });
  await shot(page, 'intake-fringe-phone');
  await page.setViewportSize({ width: 1280, height: 720 });
  await expect(page.getByTestId('verdict')).toHaveText('A small fix at home, then it can go');
  await expect(result).toContainText('Fringe can wrap around tiny fingers and toes');
  await expect(result).toContainText('Take the fringe off');
  await expect(result).toContainText("Bramblewick Children's Ward");
  await expect(page.getByText('Safety first').first()).toBeVisible();
  await shot(page, 'intake-fringe-infant');

  await page.getByRole('button', { name: /^Send to Bramblewick Children's Ward/ }).click();
  // It fits the ward as it is, so no override reason is asked for.
  await expect(page.getByLabel('Why not the suggested outcome?')).toHaveCount(0);
  await page.getByRole('button', { name: /Record: send to Bramblewick/ }).click();
  await expect(page.getByText("Going to Bramblewick Children's Ward, Thimbleford General.")).toBeVisible();
  await expect(page.getByRole('list', { name: 'History' })).toContainText("sent to Bramblewick Children's Ward");
  await shot(page, 'intake-redirected');
});

test('an organiser must give a reason to pass a blanket the check would send back', async ({ page, baseURL }) => {
  const code = await logFinishedCribBlanket(baseURL!, ['fringe']);
  await signIn(page, 'organiser');
  await findAndReceive(page, code);
  await page.getByRole('button', { name: 'All six are fine' }).click();
  await page.getByRole('button', { name: /^Checked, ready to go/ }).click();
  const record = page.getByRole('button', { name: /Record: checked/ });
  await expect(record).toBeDisabled();
  await page.getByLabel('Why not the suggested outcome?').fill('The shelter asked for this one for an older sibling');
  await record.click();
  await expect(page.getByText('Reason given: The shelter asked for this one')).toBeVisible();
});
