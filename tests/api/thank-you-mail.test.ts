import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { DEMO_PASSWORD, makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { hashPassword } from '../../server/auth/password';
import { MailMessage } from '../../server/db/models/mail-message';
import { Recipient } from '../../server/db/models/recipient';
import { Site } from '../../server/db/models/site';
import { User } from '../../server/db/models/user';
import type { RunView } from '@shared/schemas/run';
import { assignedBlanket } from '../fixtures/runs';

let t: TestApp;
let coordinator: Client;
let organiser: Client;
let driver: User;
let site: Site;

const today = new Date().toISOString().slice(0, 10);

beforeAll(async () => {
  t = await makeTestApp();
  coordinator = await signedIn(t.app, 'coordinator');
  organiser = await signedIn(t.app, 'organiser');
  driver = (await User.findOne({ where: { email: 'organiser@example.org' } }))!;
  site = (await Site.findOne({ where: { name: 'Millrace Community Hall' } }))!;
});
afterAll(async () => t.close());

/** A recipient with nothing else waiting, so the stop carries exactly the blankets a test makes. */
async function freshRecipient(name: string, contactName: string) {
  return Recipient.create({
    name,
    kind: 'family-shelter',
    population: 'adult',
    address: '3 Bobbin Lane, Thimbleford',
    lat: 51.5,
    lng: -1.2,
    contactName,
    guidelines: {},
  } as unknown as Recipient);
}

async function packedStop(recipientId: number) {
  const made = await coordinator.post('/api/runs', { runDate: today, driverId: driver.id, startSiteId: site.id, recipientIds: [recipientId] });
  expect(made.status, JSON.stringify(made.body)).toBe(201);
  const run = made.body.run as RunView;
  const stop = run.stops[0]!;
  const packed = await organiser.post(`/api/runs/${run.id}/stops/${stop.id}/packed`, {});
  expect(packed.status, JSON.stringify(packed.body)).toBe(200);
  return { run, stop };
}

async function newMaker(email: string, name: string, optedIn: boolean) {
  const maker = await User.create({ name, email, passwordHash: await hashPassword(DEMO_PASSWORD, t.config.scryptLogN), role: 'volunteer' });
  const me = await signedIn(t.app, email);
  expect((await me.get('/api/users/me/thank-you-mail')).body).toEqual({ thankYouMail: false });
  if (optedIn) {
    // Opt in the way a maker does, through the account setting.
    const put = await me.put('/api/users/me/thank-you-mail', { thankYouMail: true });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    expect((await me.get('/api/users/me/thank-you-mail')).body).toEqual({ thankYouMail: true });
  }
  return maker;
}

const mailTo = (email: string) => MailMessage.findAll({ where: { to: email }, order: [['id', 'ASC']] });

describe('the thank-you e-mail on delivery', () => {
  it('an opted-in maker gets one message naming the recipient, never who signed; an opted-out maker gets none', async () => {
    const glad = await newMaker('linnet.thank@example.org', 'Linnet Crewel', true);
    const quiet = await newMaker('sorrel.quiet@example.org', 'Sorrel Purl', false);
    const recipient = await freshRecipient('Wickhollow Family Refuge', 'Bettany Skein');
    const mine = [await assignedBlanket(glad.id, recipient.id), await assignedBlanket(glad.id, recipient.id)];
    const theirs = await assignedBlanket(quiet.id, recipient.id);
    const { run, stop } = await packedStop(recipient.id);
    expect(await mailTo(glad.email)).toHaveLength(0);

    const done = await coordinator.post(`/api/runs/${run.id}/stops/${stop.id}/delivered`, { receivedCount: 3, signedBy: 'Hazel Warpfield' });
    expect(done.status, JSON.stringify(done.body)).toBe(200);

    const got = await mailTo(glad.email);
    expect(got).toHaveLength(1);
    const m = got[0]!;
    expect(m.subject).toBe('Your 2 blankets have been delivered');
    expect(m.text).toContain('Hello Linnet,');
    expect(m.text).toContain('Wickhollow Family Refuge');
    for (const b of mine) expect(m.text).toContain(b.code);
    expect(m.text).not.toContain(theirs.code);
    // Neither the person who signed nor the recipient's contact is named.
    expect(`${m.subject}\n${m.text}\n${m.html ?? ''}`).not.toMatch(/Hazel|Warpfield|Bettany|Skein/);
    expect(await mailTo(quiet.email)).toHaveLength(0);
  });

  it('marking delivered twice (again at once, or after undoing it) sends nothing twice', async () => {
    const glad = await newMaker('wren.twice@example.org', 'Wren Tallow', true);
    const recipient = await freshRecipient('Loomside Night Shelter', 'Tamsin Heald');
    await assignedBlanket(glad.id, recipient.id);
    const { run, stop } = await packedStop(recipient.id);
    const deliver = () => coordinator.post(`/api/runs/${run.id}/stops/${stop.id}/delivered`, { receivedCount: 1, signedBy: 'Night desk' });
    expect((await deliver()).status).toBe(200);
    expect((await deliver()).status).toBe(409);
    expect(await mailTo(glad.email)).toHaveLength(1);

    const undo = await coordinator.delete(`/api/runs/${run.id}/stops/${stop.id}/delivered`).send({ reason: 'Marked on the wrong stop' });
    expect(undo.status).toBe(200);
    expect((await deliver()).status).toBe(200);
    expect(await mailTo(glad.email)).toHaveLength(1);
  });

  it('the message is written with the move: a refused delivery leaves nothing in the outbox', async () => {
    const glad = await newMaker('tansy.refused@example.org', 'Tansy Moss', true);
    const recipient = await freshRecipient('Cobble Row Day Centre', 'Ivo Hank');
    await assignedBlanket(glad.id, recipient.id);
    const made = await coordinator.post('/api/runs', { runDate: today, driverId: driver.id, startSiteId: site.id, recipientIds: [recipient.id] });
    const run = made.body.run as RunView;
    // Not packed yet: the delivery is refused and no thank-you goes out.
    const refused = await coordinator.post(`/api/runs/${run.id}/stops/${run.stops[0]!.id}/delivered`, { receivedCount: 1, signedBy: 'Desk' });
    expect(refused.status).toBe(409);
    expect(await MailMessage.count({ where: { to: { [Op.eq]: glad.email } } })).toBe(0);
  });

  it('the setting takes only true or false', async () => {
    const volunteer = await signedIn(t.app, 'volunteer');
    const bad = await volunteer.put('/api/users/me/thank-you-mail', { thankYouMail: 'yes' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe('thankYouMail');
  });

  it('in the demo, delivering the upcoming run thanks the makers who opted in and no one else', async () => {
    // The demo's run later this week, not the runs the tests above planned for today.
    const upcoming = await coordinator.get('/api/runs?when=upcoming&pageSize=50');
    const demoRun = (upcoming.body.items as RunView[]).find((r) => r.runDate > today)!;
    const run = (await coordinator.get(`/api/runs/${demoRun.id}`)).body.run as RunView;
    const packed = run.stops.filter((s) => s.state === 'packed');
    expect(packed.length).toBeGreaterThan(1);
    const makers = await User.findAll({ where: { email: ['ines@example.org', 'agnes@example.org', 'maren@example.org'] } });
    const optedIn = makers.filter((m) => m.thankYouMail).map((m) => m.email).sort();
    expect(optedIn).toEqual(['agnes@example.org', 'ines@example.org']);
    const before = new Map<string, number>();
    for (const m of makers) before.set(m.email, (await mailTo(m.email)).length);
    for (const stop of packed) {
      const done = await coordinator.post(`/api/runs/${run.id}/stops/${stop.id}/delivered`, { receivedCount: stop.blankets.length, signedBy: 'Duty nurse Pell' });
      expect(done.status, JSON.stringify(done.body)).toBe(200);
    }
    for (const m of makers) {
      const fresh = (await mailTo(m.email)).slice(before.get(m.email));
      expect(fresh.length, m.email).toBe(m.thankYouMail ? 1 : 0);
      for (const mail of fresh) {
        expect(mail.subject).toMatch(/delivered/);
        expect(mail.text).not.toContain('Pell');
      }
    }
  });
});
