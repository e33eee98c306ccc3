import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { InferCreationAttributes } from 'sequelize';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Blanket } from '../../server/db/models/blanket';
import { BlanketEvent } from '../../server/db/models/blanket-event';
import { MailMessage } from '../../server/db/models/mail-message';
import { Recipient } from '../../server/db/models/recipient';
import { Site } from '../../server/db/models/site';
import { User } from '../../server/db/models/user';
import type { BlanketStatus } from '@shared/schemas/blanket';
import { codeFromBytes } from '@shared/blankets/code';
import { allGoodChecklist as allGood, plainBlanket } from '../fixtures/blankets';

let t: TestApp;
let organiser: Client;
let coordinator: Client;
let volunteer: Client;
let maker: User;
let otherMaker: User;
const rid: Record<string, number> = {};
let library: Site;
let hall: Site;

let codeCounter = 0;
const nextCode = () => {
  const n = codeCounter++;
  return codeFromBytes(Uint8Array.from([7, 3, (n >> 5) & 31, n & 31]));
};

type BlanketAttributes = InferCreationAttributes<Blanket>;

async function blanket(over: Partial<Record<keyof BlanketAttributes, unknown>> = {}) {
  const code = nextCode();
  return Blanket.create({
    code,
    userId: maker.id,
    recipientId: rid['family-shelter'],
    status: 'finished',
    ...plainBlanket(),
    ...over,
  } as unknown as BlanketAttributes);
}

async function received(over: Partial<Record<keyof BlanketAttributes, unknown>> = {}) {
  const b = await blanket(over);
  const res = await organiser.post(`/api/blankets/${b.id}/intake`, { siteId: hall.id, widthCm: b.widthCm, lengthCm: b.lengthCm });
  expect(res.status).toBe(200);
  return b;
}

beforeAll(async () => {
  t = await makeTestApp();
  organiser = await signedIn(t.app, 'organiser');
  coordinator = await signedIn(t.app, 'coordinator');
  volunteer = await signedIn(t.app, 'volunteer');
  maker = (await User.findOne({ where: { email: 'volunteer@example.org' } }))!;
  otherMaker = (await User.findOne({ where: { email: 'maren@example.org' } }))!;
  for (const r of await Recipient.findAll()) if (r.kind !== 'care-home') rid[r.kind] = r.id;
  library = (await Site.findOne({ where: { name: 'Thimbleford Library' } }))!;
  hall = (await Site.findOne({ where: { name: 'Millrace Community Hall' } }))!;
});
afterAll(async () => t.close());

describe('finding a blanket by its code', () => {
  it('finds it however the code was typed or scanned, with the pre-filled check', async () => {
    const b = await blanket({ features: ['fringe'], widthCm: 85, lengthCm: 105 });
    for (const typed of [b.code, b.code.toLowerCase(), b.code.replace('KL-', ''), ` ${b.code} `, `http://x/organiser/intake?code=${b.code}`]) {
      const res = await organiser.get(`/api/blankets/by-code/${encodeURIComponent(typed)}`);
      expect(res.status, typed).toBe(200);
      expect(res.body.blanket.code).toBe(b.code);
    }
    const res = await organiser.get(`/api/blankets/by-code/${b.code}`);
    expect(res.body.blanket.maker).toMatchObject({ id: maker.id, name: 'Wren Calloway', label: 'Wren' });
    expect(res.body.blanket.recipient.id).toBe(rid['family-shelter']);
    expect(res.body.check.verdict).toBe('mend');
    expect(res.body.check.reasons[0].rule).toBe('feature.fringe');
    expect(res.body.check.cautions.map((c: { id: string }) => c.id)).toContain('infant.supervised-only');
  });

  it('answers 404 for an unknown code and 400 naming the field for one that cannot be a code', async () => {
    expect((await organiser.get('/api/blankets/by-code/KL-ZZZZ')).status).toBe(404);
    const bad = await organiser.get('/api/blankets/by-code/hello!');
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe('code');
  });

  it('is for organisers and coordinators only', async () => {
    const b = await blanket();
    expect((await volunteer.get(`/api/blankets/by-code/${b.code}`)).status).toBe(403);
    expect((await coordinator.get(`/api/blankets/by-code/${b.code}`)).status).toBe(200);
  });
});

describe('receiving a blanket', () => {
  it('receives a finished blanket without a booking, re-measured, and records who, where and what was measured', async () => {
    const b = await blanket();
    const res = await organiser.post(`/api/blankets/${b.id}/intake`, { siteId: library.id, widthCm: 78.5, lengthCm: 101, note: 'Slightly damp bag', version: b.version });
    expect(res.status).toBe(200);
    expect(res.body.blanket).toMatchObject({ status: 'received', widthCm: 78.5, lengthCm: 101, measured: true, site: { id: library.id } });
    // The maker's own figures stay on record beside the measurement.
    expect(res.body.blanket.logged).toEqual({ widthCm: 80, lengthCm: 100 });
    const row = (await Blanket.findByPk(b.id))!;
    expect([row.widthCm, row.lengthCm, row.measuredWidthCm, row.measuredLengthCm]).toEqual([80, 100, 78.5, 101]);
    expect(res.body.blanket.receivedAt).not.toBeNull();
    const event = res.body.blanket.history.at(-1);
    expect(event).toMatchObject({ kind: 'intake', fromStatus: 'finished', toStatus: 'received', actor: { name: 'Odile Farrant' } });
    expect(event.data).toMatchObject({
      siteId: library.id,
      logged: { widthCm: 80, lengthCm: 100 },
      measured: { widthCm: 78.5, lengthCm: 101 },
      note: 'Slightly damp bag',
    });
    expect(res.body.check.verdict).toBe('ready');
  });

  it.each<BlanketStatus>(['booked', 'needs_fix'])('receives a blanket that is %s', async (status) => {
    const b = await blanket({ status });
    const res = await organiser.post(`/api/blankets/${b.id}/intake`, { siteId: hall.id, widthCm: 80, lengthCm: 100 });
    expect(res.status).toBe(200);
    expect(res.body.blanket.history.at(-1).fromStatus).toBe(status);
  });

  it.each<BlanketStatus>(['in_progress', 'received', 'checked', 'delivered'])('refuses with 409 a blanket that is %s, changing nothing', async (status) => {
    const b = await blanket({ status });
    const res = await organiser.post(`/api/blankets/${b.id}/intake`, { siteId: hall.id, widthCm: 70, lengthCm: 90 });
    expect(res.status).toBe(409);
    const after = await Blanket.findByPk(b.id);
    expect(after!.status).toBe(status);
    expect(after!.widthCm).toBe(80);
    expect(await BlanketEvent.count({ where: { blanketId: b.id } })).toBe(0);
  });

  it.each([
    [{ siteId: 'hall' }, 'siteId'],
    [{ widthCm: 0 }, 'widthCm'],
    [{ lengthCm: 999 }, 'lengthCm'],
    [{ widthCm: undefined }, 'widthCm'],
  ])('answers 400 naming the field for %j and changes nothing', async (over, field) => {
    const b = await blanket();
    const res = await organiser.post(`/api/blankets/${b.id}/intake`, { siteId: hall.id, widthCm: 80, lengthCm: 100, ...over });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe(field);
    expect((await Blanket.findByPk(b.id))!.status).toBe('finished');
  });

  it('names siteId for a site that does not exist or is closed', async () => {
    const b = await blanket();
    const missing = await organiser.post(`/api/blankets/${b.id}/intake`, { siteId: 99999, widthCm: 80, lengthCm: 100 });
    expect(missing.status).toBe(400);
    expect(missing.body.error.issues[0].path).toBe('siteId');
    const closed = await Site.create({ name: 'Shut Barn', address: 'Nowhere Lane, Thimbleford', lat: null, lng: null, active: false });
    const res = await organiser.post(`/api/blankets/${b.id}/intake`, { siteId: closed.id, widthCm: 80, lengthCm: 100 });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/Shut Barn/);
  });

  it('refuses a stale version with 409', async () => {
    const b = await blanket();
    const res = await organiser.post(`/api/blankets/${b.id}/intake`, { siteId: hall.id, widthCm: 80, lengthCm: 100, version: b.version + 5 });
    expect(res.status).toBe(409);
    expect(res.body.error.issues[0].path).toBe('version');
  });

  it('refuses volunteers with 403, even for their own blanket', async () => {
    const b = await blanket();
    const res = await volunteer.post(`/api/blankets/${b.id}/intake`, { siteId: hall.id, widthCm: 80, lengthCm: 100 });
    expect(res.status).toBe(403);
    expect((await Blanket.findByPk(b.id))!.status).toBe('finished');
  });
});

describe('inspecting a blanket', () => {
  it('takes a clean blanket from received to checked, recording the checklist and the check', async () => {
    const b = await received();
    const res = await organiser.post(`/api/blankets/${b.id}/inspection`, { checklist: allGood, outcome: 'checked' });
    expect(res.status).toBe(200);
    expect(res.body.blanket.status).toBe('checked');
    const event = res.body.blanket.history.at(-1);
    expect(event).toMatchObject({ kind: 'inspection', fromStatus: 'received', toStatus: 'checked', reason: null, actor: { name: 'Odile Farrant' } });
    expect(event.data).toMatchObject({
      checklist: allGood,
      check: { recipientId: rid['family-shelter'], verdict: 'ready', reasons: [] },
      suggested: { outcome: 'checked' },
      outcome: 'checked',
      overridden: false,
    });
  });

  it('refuses volunteers with 403 and leaves the blanket as it was', async () => {
    const b = await received();
    const res = await volunteer.post(`/api/blankets/${b.id}/inspection`, { checklist: allGood, outcome: 'checked' });
    expect(res.status).toBe(403);
    expect((await Blanket.findByPk(b.id))!.status).toBe('received');
  });

  it('sends a blanket with fringe back to its maker with an e-mail saying what to fix, in the same step', async () => {
    const b = await received({ features: ['fringe'], widthCm: 85, lengthCm: 105 });
    const before = await MailMessage.count();
    const res = await organiser.post(`/api/blankets/${b.id}/inspection`, {
      checklist: { ...allGood, endsWovenIn: false },
      outcome: 'needs_fix',
      fixNote: 'Lovely colours!',
    });
    expect(res.status).toBe(200);
    expect(res.body.blanket.status).toBe('needs_fix');
    expect(await MailMessage.count()).toBe(before + 1);
    const mail = await MailMessage.findOne({ order: [['id', 'DESC']] });
    expect(mail!.to).toBe('volunteer@example.org');
    expect(mail!.subject).toContain(b.code);
    expect(mail!.text).toMatch(/Take the fringe off/);
    expect(mail!.text).toMatch(/Weave in the loose yarn ends/);
    expect(mail!.text).toMatch(/Lovely colours!/);
    expect(mail!.text).toMatch(/Harbour Lantern Family Shelter/);
  });

  it('redirects a fringed infant blanket to a recipient that takes it as it is, without needing a reason', async () => {
    const b = await received({ features: ['fringe'], widthCm: 85, lengthCm: 105 });
    const found = await organiser.get(`/api/blankets/by-code/${b.code}`);
    const also = found.body.check.alsoFits.map((a: { recipientId: number }) => a.recipientId);
    expect(also).toContain(rid['childrens-ward']);
    const res = await organiser.post(`/api/blankets/${b.id}/inspection`, {
      checklist: allGood,
      outcome: 'redirect',
      redirectRecipientId: rid['childrens-ward'],
    });
    expect(res.status).toBe(200);
    expect(res.body.blanket).toMatchObject({ status: 'checked', recipient: { id: rid['childrens-ward'] } });
    expect(res.body.check).toMatchObject({ ok: true, verdict: 'ready' });
    expect(res.body.blanket.history.at(-1).data).toMatchObject({
      outcome: 'redirect',
      redirect: { fromRecipientId: rid['family-shelter'], toRecipientId: rid['childrens-ward'] },
      check: { verdict: 'mend' },
    });
  });

  it('needs a reason to redirect where the guidelines do not take it, and records the override', async () => {
    const b = await received({ features: ['fringe'], widthCm: 85, lengthCm: 105 });
    const body = { checklist: allGood, outcome: 'redirect', redirectRecipientId: rid['neonatal-unit'] };
    const refused = await organiser.post(`/api/blankets/${b.id}/inspection`, body);
    expect(refused.status).toBe(400);
    expect(refused.body.error.issues[0].path).toBe('overrideReason');
    expect((await Blanket.findByPk(b.id))!.status).toBe('received');
    const res = await organiser.post(`/api/blankets/${b.id}/inspection`, { ...body, overrideReason: 'The unit asked for it for a parents\' room' });
    expect(res.status).toBe(200);
    const event = res.body.blanket.history.at(-1);
    expect(event.reason).toMatch(/parents/);
    expect(event.data.overridden).toBe(true);
  });

  it('needs a reason to pass a blanket the check would send back, and keeps the reason on its history', async () => {
    const b = await received({ features: ['fringe'], widthCm: 85, lengthCm: 105 });
    const refused = await organiser.post(`/api/blankets/${b.id}/inspection`, { checklist: allGood, outcome: 'checked' });
    expect(refused.status).toBe(400);
    expect(refused.body.error.issues[0].path).toBe('overrideReason');
    expect(refused.body.error.message).toMatch(/back to the maker/);
    const ok = await organiser.post(`/api/blankets/${b.id}/inspection`, {
      checklist: allGood,
      outcome: 'checked',
      overrideReason: 'Fringe was taken off at the table with the maker',
      corrections: { features: [] },
    });
    // With the correction the check passes, so no override is left to record.
    expect(ok.status).toBe(200);
    expect(ok.body.blanket.features).toEqual([]);
    expect(ok.body.blanket.history.at(-1).data.corrections).toEqual({ features: { from: ['fringe'], to: [] } });
  });

  it('suggests declining a blanket that smells of smoke for a unit that wants smoke-free homes', async () => {
    const b = await received();
    const asChecked = await organiser.post(`/api/blankets/${b.id}/inspection`, { checklist: { ...allGood, noSmokeOrPetOdour: false }, outcome: 'checked' });
    expect(asChecked.status).toBe(400);
    expect(asChecked.body.error.message).toMatch(/declined/);
    const res = await organiser.post(`/api/blankets/${b.id}/inspection`, { checklist: { ...allGood, noSmokeOrPetOdour: false }, outcome: 'declined' });
    expect(res.status).toBe(200);
    expect(res.body.blanket.status).toBe('declined');
  });

  it('checks a blanket pledged "wherever it is needed most" against the recipient the organiser names', async () => {
    const b = await received({ recipientId: null, widthCm: 45, lengthCm: 45, yarnWeight: 2 });
    const none = await organiser.post(`/api/blankets/${b.id}/inspection`, { checklist: allGood, outcome: 'checked' });
    expect(none.status).toBe(400);
    expect(none.body.error.issues[0].path).toBe('recipientId');
    const res = await organiser.post(`/api/blankets/${b.id}/inspection`, { checklist: allGood, outcome: 'checked', recipientId: rid['neonatal-unit'] });
    expect(res.status).toBe(200);
    expect(res.body.blanket.recipient.id).toBe(rid['neonatal-unit']);
  });

  it('asks what differs when it does not match its log', async () => {
    const b = await received();
    const res = await organiser.post(`/api/blankets/${b.id}/inspection`, { checklist: { ...allGood, matchesLog: false }, outcome: 'checked' });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('corrections');
  });

  it('needs a note for the maker when it goes back with nothing the check found', async () => {
    const b = await received();
    const res = await organiser.post(`/api/blankets/${b.id}/inspection`, { checklist: allGood, outcome: 'needs_fix', overrideReason: 'Seam is weak' });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('fixNote');
    const ok = await organiser.post(`/api/blankets/${b.id}/inspection`, { checklist: allGood, outcome: 'needs_fix', overrideReason: 'Seam is weak', fixNote: 'Please re-join the seam on the left side.' });
    expect(ok.status).toBe(200);
  });

  it('refuses to inspect a blanket that has not been received', async () => {
    const b = await blanket();
    const res = await organiser.post(`/api/blankets/${b.id}/inspection`, { checklist: allGood, outcome: 'checked' });
    expect(res.status).toBe(409);
  });

  it.each([
    [{ checklist: { ...allGood, clean: 'yes' } }, 'checklist.clean'],
    [{ checklist: undefined }, 'checklist'],
    [{ outcome: 'lost' }, 'outcome'],
    [{ outcome: 'redirect' }, 'redirectRecipientId'],
    [{ redirectRecipientId: 2 }, 'redirectRecipientId'],
    [{ corrections: { widthCm: -3 } }, 'corrections.widthCm'],
    [{ corrections: { colour: 'red' } }, 'corrections'],
  ])('answers 400 naming the field for %j', async (over, field) => {
    const b = await received();
    const res = await organiser.post(`/api/blankets/${b.id}/inspection`, { checklist: allGood, outcome: 'checked', ...over });
    expect(res.status).toBe(400);
    expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain(field);
    expect((await Blanket.findByPk(b.id))!.status).toBe('received');
  });
});

describe('the intake queue', () => {
  it('shows what arrived at a site today, what waits and what was inspected, and nothing from other sites', async () => {
    const today = new Date();
    const iso = `${today.getFullYear()}-${String(today.getMonth() + 1).padStart(2, '0')}-${String(today.getDate()).padStart(2, '0')}`;
    const waiting = await received();
    const done = await received();
    await organiser.post(`/api/blankets/${done.id}/inspection`, { checklist: allGood, outcome: 'checked' });
    const elsewhere = await blanket();
    await organiser.post(`/api/blankets/${elsewhere.id}/intake`, { siteId: library.id, widthCm: 80, lengthCm: 100 });
    const booked = await blanket({ status: 'booked', siteId: hall.id });

    const res = await organiser.get(`/api/intake/queue?siteId=${hall.id}&date=${iso}`);
    expect(res.status).toBe(200);
    const q = res.body.queue;
    const codes = (list: Array<{ code: string }>) => list.map((i) => i.code);
    expect(q.site.name).toBe('Millrace Community Hall');
    expect(codes(q.arrived)).toEqual(expect.arrayContaining([waiting.code, done.code]));
    expect(codes(q.arrived)).not.toContain(elsewhere.code);
    expect(codes(q.waiting)).toContain(waiting.code);
    expect(codes(q.waiting)).not.toContain(done.code);
    expect(codes(q.inspected)).toContain(done.code);
    expect(q.inspected.find((i: { code: string }) => i.code === done.code).status).toBe('checked');
    expect(codes(q.expected)).toEqual([booked.code]);
    expect(q.arrived[0].makerLabel).toBe('Wren');

    const yesterday = await organiser.get(`/api/intake/queue?siteId=${hall.id}&date=2001-01-01`);
    expect(yesterday.body.queue.arrived).toEqual([]);
    expect(yesterday.body.queue.waiting).toEqual([]);
  });

  it('answers 400 naming the field for a bad query, 404 for a missing site and 403 for volunteers', async () => {
    const bad = await organiser.get(`/api/intake/queue?siteId=${hall.id}&date=31/12/2030`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe('date');
    const noSite = await organiser.get('/api/intake/queue?date=2030-12-31');
    expect(noSite.body.error.issues[0].path).toBe('siteId');
    expect((await organiser.get('/api/intake/queue?siteId=99999&date=2030-12-31')).status).toBe(404);
    expect((await volunteer.get(`/api/intake/queue?siteId=${hall.id}&date=2030-12-31`)).status).toBe(403);
  });
});

describe('tag sheets', () => {
  it('gives each tag the code, the maker\'s label, the size and a QR code that links to the intake page', async () => {
    const named = await blanket();
    const anonymous = await blanket({ labelName: 'anonymous' });
    const res = await organiser.get(`/api/blankets/tags?ids=${named.id},${anonymous.id}`);
    expect(res.status).toBe(200);
    const [a, b] = res.body.tags;
    expect(a).toMatchObject({ id: named.id, code: named.code, makerLabel: 'Wren', widthCm: 80, lengthCm: 100, sizeCategory: 'crib' });
    expect(a.link).toMatch(new RegExp(`/organiser/intake\\?code=${named.code}$`));
    expect(a.recipientPopulation).toBe('infant');
    expect(a.qrSvg).toMatch(/^<svg[\s\S]*<\/svg>\s*$/);
    expect(b.makerLabel).toBe('Anonymous');
    expect(b.qrSvg).not.toBe(a.qrSvg);
  });

  it('lets a volunteer print tags for their own blankets only', async () => {
    const mine = await blanket();
    const theirs = await blanket({ userId: otherMaker.id });
    expect((await volunteer.get(`/api/blankets/tags?ids=${mine.id}`)).status).toBe(200);
    const res = await volunteer.get(`/api/blankets/tags?ids=${mine.id},${theirs.id}`);
    expect(res.status).toBe(404);
    expect(res.body.error.message).not.toContain(String(mine.id) + ',');
  });

  it('answers 400 naming ids for a list that is not one', async () => {
    const res = await organiser.get('/api/blankets/tags?ids=1;2');
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('ids');
    const many = Array.from({ length: 61 }, (_, i) => i + 1).join(',');
    expect((await organiser.get(`/api/blankets/tags?ids=${many}`)).status).toBe(400);
  });
});
