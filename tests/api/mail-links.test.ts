import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedIn, Client, type TestApp } from './test-app';
import * as templates from '../../server/mail/templates';
import { appLinks } from '../../server/mail/links';
import { Blanket } from '../../server/db/models/blanket';
import { MailMessage } from '../../server/db/models/mail-message';
import { Recipient } from '../../server/db/models/recipient';
import { Site } from '../../server/db/models/site';
import { User } from '../../server/db/models/user';
import { allGoodChecklist, plainBlanket } from '../fixtures/blankets';

const APP = 'http://kindloop.example.org';

/** The client's page paths, read from the router itself so a renamed page fails here. */
function clientRoutes(): string[] {
  const src = fs.readFileSync(path.join(__dirname, '../../src/app/router.tsx'), 'utf8');
  const paths = [...src.matchAll(/path:\s*'([^']+)'/g)].map((m) => m[1]!).filter((p) => p !== '*' && p !== '/');
  expect(paths.length).toBeGreaterThan(5);
  return ['/', ...paths.map((p) => `/${p}`)];
}

/** Whether a URL's path is one of the client's pages (":id" matches one segment). */
function isClientPage(url: string, routes: string[]): boolean {
  const parts = new URL(url).pathname.split('/').filter(Boolean);
  return routes.some((r) => {
    const want = r.split('/').filter(Boolean);
    return want.length === parts.length && want.every((w, i) => w.startsWith(':') || w === parts[i]);
  });
}

const linksIn = (text: string) => [...text.matchAll(/https?:\/\/[^\s<>"')]+/g)].map((m) => m[0]);

/**
 * One way to fill each template. A new template needs a line here, so its links are checked too.
 */
const SAMPLES: Record<string, () => { subject: string; text: string }> = {
  passwordResetMail: () => templates.passwordResetMail('Ada', appLinks.resetPassword(APP, 'abc_DEF-123'), 60),
  welcomeMail: () => templates.welcomeMail('Ada', APP),
  blanketNeedsFixMail: () =>
    templates.blanketNeedsFixMail({
      name: 'Ada',
      code: 'KL-7Q4M',
      blanketId: 12,
      recipientName: 'Thimbleford Newborn Unit',
      fixes: ['Weave in the loose yarn ends securely, so none can be pulled out.'],
      logged: { widthCm: 80, lengthCm: 100 },
      measured: { widthCm: 78, lengthCm: 96 },
      appUrl: APP,
    }),
  deliveryThankYouMail: () => templates.deliveryThankYouMail({ name: 'Ada', recipientName: 'Thimbleford Newborn Unit', codes: ['KL-7Q4M', 'KL-3HXP'], appUrl: APP }),
};

describe('links in mail', () => {
  it('every link builder lands on a page of the client', () => {
    const routes = clientRoutes();
    const built = [appLinks.home(APP), appLinks.resetPassword(APP, 'x'), appLinks.blanket(APP, 3), appLinks.myBlankets(APP), appLinks.dropOff(APP)];
    expect(Object.keys(appLinks)).toHaveLength(built.length);
    for (const url of built) expect(isClientPage(url, routes), url).toBe(true);
    // The check itself: the old needs-fix link is not a page.
    expect(isClientPage(`${APP}/my/blankets`, routes)).toBe(false);
  });

  it('every link in every template lands on a page of the client', () => {
    const routes = clientRoutes();
    const names = Object.entries(templates).filter(([, v]) => typeof v === 'function').map(([k]) => k);
    for (const name of names) {
      const sample = SAMPLES[name];
      expect(sample, `add a sample for the mail template ${name} to this test`).toBeDefined();
      const mail = sample!();
      const links = linksIn(mail.text);
      expect(links.length, `${name} carries a link`).toBeGreaterThan(0);
      for (const url of links) {
        expect(url.startsWith(APP), `${name}: ${url} points into the app`).toBe(true);
        expect(isClientPage(url, routes), `${name}: ${url}`).toBe(true);
      }
    }
  });
});

describe('links in the mail the app actually sends', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await makeTestApp();
  });
  afterAll(async () => t.close());

  it('welcome, password reset and needs-a-fix messages all link to pages that exist', async () => {
    const routes = clientRoutes();
    const guest = new Client(t.app);
    await guest.refreshToken();
    const joined = await guest.post('/api/auth/register', { name: 'Wren Tallow', email: 'wren@example.org', password: 'a long enough passphrase for the test' });
    expect(joined.status, JSON.stringify(joined.body)).toBeLessThan(300);
    const other = new Client(t.app);
    await other.refreshToken();
    expect((await other.post('/api/auth/password-reset', { email: 'volunteer@example.org' })).status).toBe(202);

    const organiser = await signedIn(t.app, 'organiser');
    const maker = (await User.findOne({ where: { email: 'volunteer@example.org' } }))!;
    const shelter = (await Recipient.findOne({ where: { kind: 'family-shelter' } }))!;
    const hall = (await Site.findOne({ where: { name: 'Millrace Community Hall' } }))!;
    const b = await Blanket.create({ code: 'KL-MAIL', userId: maker.id, recipientId: shelter.id, status: 'finished', ...plainBlanket() });
    expect((await organiser.post(`/api/blankets/${b.id}/intake`, { siteId: hall.id, widthCm: 78, lengthCm: 97 })).status).toBe(200);
    const fix = await organiser.post(`/api/blankets/${b.id}/inspection`, { checklist: { ...allGoodChecklist, endsWovenIn: false }, outcome: 'needs_fix' });
    expect(fix.status, JSON.stringify(fix.body)).toBe(200);

    const mails = await MailMessage.findAll();
    const subjects = mails.map((m) => m.subject);
    expect(subjects).toEqual(expect.arrayContaining(['Welcome to Kindloop', 'Reset your Kindloop password', 'Blanket KL-MAIL: a small fix, please']));
    const app = t.config.publicUrl;
    for (const m of mails) {
      for (const url of linksIn(`${m.text}\n${m.html ?? ''}`).filter((u) => u.startsWith(app))) {
        expect(isClientPage(url, routes), `${m.subject}: ${url}`).toBe(true);
      }
    }
    const fixMail = mails.find((m) => m.subject.startsWith('Blanket KL-MAIL'))!;
    expect(fixMail.text).toContain(`${app}/blankets/${b.id}`);
    expect(fixMail.text).toMatch(/measured it at 78 × 97 cm \(you logged 80 × 100 cm\)/);
  });
});
