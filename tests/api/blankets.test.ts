import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Blanket } from '../../server/db/models/blanket';
import { Site } from '../../server/db/models/site';
import { BlanketEvent } from '../../server/db/models/blanket-event';
import { Pledge } from '../../server/db/models/pledge';
import { Need } from '../../server/db/models/need';
import { Plan } from '../../server/db/models/plan';
import { Recipient } from '../../server/db/models/recipient';
import { User } from '../../server/db/models/user';
import { uniqueBlanketCode } from '../../server/modules/blankets/blanket-code';
import { guidelinesOf } from '../../server/modules/pledges/recipient-brief';
import { check } from '@shared/guidelines/check';
import { CODE_ALPHABET, CODE_PREFIX, isBlanketCode } from '@shared/blankets/code';
import type { BlanketDetail, BlanketSummary } from '@shared/schemas/blanket-log';
import type { PledgeView } from '@shared/schemas/pledge';
import { allGoodChecklist as ALL_GOOD } from '../fixtures/blankets';

let t: TestApp;
let vol: Client;
let maren: Client;
let organiser: Client;
let coordinator: Client;

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

/** A preemie blanket the demo newborn unit takes as it is. */
const goodPreemie = {
  widthCm: 45,
  lengthCm: 48,
  yarnWeight: 3,
  fibres: ['acrylic'],
  colours: 'sage and cream',
  bodyStitch: 'hdc',
  borderId: 'crab-stitch-edge',
  features: [],
  machineWashable: true,
  dryerSafe: true,
  smokeFree: true,
  petFree: true,
  labelName: 'first-name',
  notes: '',
};

async function needFor(kind: string, size: string) {
  const needs = (await Need.findAll({ include: [{ model: Recipient, as: 'recipient' }] })) as Array<Need & { recipient: Recipient }>;
  return needs.find((x) => x.recipient.kind === kind && x.sizeCategory === size)!;
}

/** A fresh pledge of `quantity` for the newborn unit, so each test has room to log. */
async function preemiePledge(c: Client, quantity = 3): Promise<PledgeView> {
  const n = await needFor('neonatal-unit', 'preemie');
  const res = await c.post('/api/pledges', { needId: n.id, quantity, sizeCategory: 'preemie', dueDate: n.deadline });
  expect(res.status).toBe(201);
  return res.body.pledge;
}

async function logBlanket(c: Client, pledgeId: number, extra: Record<string, unknown> = {}) {
  const res = await c.post('/api/blankets', { ...goodPreemie, pledgeId, ...extra });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.blanket as BlanketDetail;
}

beforeAll(async () => {
  t = await makeTestApp();
  vol = await signedIn(t.app, 'volunteer');
  maren = await signedIn(t.app, 'maren@example.org');
  organiser = await signedIn(t.app, 'organiser');
  coordinator = await signedIn(t.app, 'coordinator');
});
afterAll(async () => t.close());

describe('the demo', () => {
  it('gives the demo volunteer three blankets in three different statuses', async () => {
    const res = await vol.get('/api/blankets');
    expect(res.status).toBe(200);
    const mine = res.body.items as BlanketSummary[];
    expect(mine).toHaveLength(3);
    expect(new Set(mine.map((b) => b.status)).size).toBe(3);
  });

  it('has every demo blanket that got past inspection meet its recipient\'s guidelines', async () => {
    const passed = await Blanket.findAll({
      where: { status: ['checked', 'assigned', 'packed', 'delivered'] },
      include: [{ model: Recipient, as: 'recipient' }],
    });
    expect(passed.length).toBeGreaterThan(3);
    for (const b of passed as Array<Blanket & { recipient: Recipient | null }>) {
      if (!b.recipient) {
        // Pledged for wherever needed: it must fit some recipient, or have been kept with the organiser's reason.
        const fields = { ...b.get(), features: b.features, fibres: b.fibres };
        const fitsSomewhere = (await Recipient.findAll()).some((r) => check(fields, guidelinesOf(r)).reasons.length === 0);
        const inspection = await BlanketEvent.findOne({ where: { blanketId: b.id, kind: 'inspection' } });
        expect(fitsSomewhere || Boolean(inspection?.reason), `${b.code} fits no recipient and has no reason it was kept`).toBe(true);
        continue;
      }
      const r = check({ ...b.get(), features: b.features, fibres: b.fibres }, guidelinesOf(b.recipient));
      expect(r.reasons, `${b.code} for ${b.recipient.name}`).toEqual([]);
    }
  });

  it('records each demo step with the person who made it, in order', async () => {
    const delivered = await Blanket.findOne({ where: { status: 'delivered' } });
    const events = await BlanketEvent.findAll({ where: { blanketId: delivered!.id }, order: [['createdAt', 'ASC']] });
    expect(events.map((e) => e.toStatus)).toEqual(['in_progress', 'finished', 'booked', 'received', 'checked', 'assigned', 'packed', 'delivered']);
    const coordinatorUser = await User.findOne({ where: { email: 'coordinator@example.org' } });
    expect(events.at(-1)!.actorId).toBe(coordinatorUser!.id);
  });
});

describe('POST /api/blankets', () => {
  it('logs a blanket with the field names from the issue and answers 201 with id, code and status', async () => {
    const p = await preemiePledge(vol);
    const res = await vol.post('/api/blankets', { ...goodPreemie, pledgeId: p.id });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ id: expect.any(Number), status: 'in_progress' });
    expect(isBlanketCode(res.body.code)).toBe(true);
    const b = res.body.blanket as BlanketDetail;
    expect(b.recipientId).toBe(p.need!.recipient.id);
    expect(b.selfCheck).toMatchObject({ ok: true, verdict: 'ready' });
    expect(b.events).toHaveLength(1);
    expect(b.events[0]).toMatchObject({ kind: 'logged', toStatus: 'in_progress', actor: { name: 'Wren Calloway' } });
    expect(b.editable).toBe(true);
    expect(b.moves.map((m) => m.to)).toEqual(['finished']);
  });

  it('may log a blanket that is already finished', async () => {
    const p = await preemiePledge(vol);
    const b = await logBlanket(vol, p.id, { status: 'finished' });
    expect(b.status).toBe('finished');
  });

  it('runs the self-check on save: fringe on a newborn-unit blanket is saved but flagged with the at-home fix', async () => {
    const p = await preemiePledge(vol);
    const b = await logBlanket(vol, p.id, { features: ['fringe'] });
    expect(b.selfCheck!.ok).toBe(false);
    expect(b.selfCheck!.verdict).toBe('mend');
    const reason = b.selfCheck!.reasons.find((r) => r.rule === 'feature.fringe')!;
    expect(reason.message).toMatch(/fingers/);
    expect(reason.fix).toMatch(/fringe off/i);
    expect(b.cautions.map((c) => c.id)).toContain('infant.supervised-only');
  });

  it('gives a blanket pledged "wherever needed most" no recipient, and lists where it would fit', async () => {
    const p = await vol.post('/api/pledges', { needId: null, quantity: 1, sizeCategory: 'lap', dueDate: day(20) });
    const b = await logBlanket(vol, p.body.pledge.id, { widthCm: 90, lengthCm: 120 });
    expect(b.recipientId).toBeNull();
    expect(b.selfCheck).toBeNull();
    const names = b.fitsRecipients.map((r) => r.name);
    expect(names.some((n) => /Care Home|House/.test(n))).toBe(true);
    expect(names.some((n) => /Newborn/.test(n))).toBe(false);
  });

  const bad: Array<[string, Record<string, unknown>, string]> = [
    ['a width of 0', { widthCm: 0 }, 'widthCm'],
    ['a negative length', { lengthCm: -10 }, 'lengthCm'],
    ['an absurd size (over 400 cm)', { lengthCm: 401 }, 'lengthCm'],
    ['a width as text', { widthCm: '90cm' }, 'widthCm'],
    ['an unknown yarn weight', { yarnWeight: 8 }, 'yarnWeight'],
    ['a fractional yarn weight', { yarnWeight: 3.5 }, 'yarnWeight'],
    ['an unknown feature', { features: ['glitter'] }, 'features.0'],
    ['no fibres', { fibres: [] }, 'fibres'],
    ['an unknown fibre', { fibres: ['kevlar'] }, 'fibres.0'],
    ['an unknown body stitch', { bodyStitch: 'tunisian-magic' }, 'bodyStitch'],
    ['a border that is not in the library', { borderId: 'mystery-edge' }, 'borderId'],
    ['an unknown label choice', { labelName: 'full-name' }, 'labelName'],
    ['a missing washable declaration', { machineWashable: undefined }, 'machineWashable'],
    ['a status past finished', { status: 'delivered' }, 'status'],
    ['colours that run on', { colours: 'x'.repeat(201) }, 'colours'],
  ];
  it.each(bad)('refuses %s with a 400 naming the field, and writes nothing', async (_label, change, field) => {
    const p = await preemiePledge(vol, 1);
    const [blankets, events] = [await Blanket.count(), await BlanketEvent.count()];
    const res = await vol.post('/api/blankets', { ...goodPreemie, pledgeId: p.id, ...change });
    expect(res.status).toBe(400);
    expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain(field);
    expect(await Blanket.count()).toBe(blankets);
    expect(await BlanketEvent.count()).toBe(events);
  });

  it('refuses to be told who made it or what code it has', async () => {
    const p = await preemiePledge(vol, 1);
    const res = await vol.post('/api/blankets', { ...goodPreemie, pledgeId: p.id, code: 'KL-AAAA' });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/code/);
    expect((await vol.post('/api/blankets', { ...goodPreemie, pledgeId: p.id, userId: 3 })).status).toBe(400);
  });

  it("answers 404 naming pledgeId for someone else's pledge", async () => {
    const theirs = ((await maren.get('/api/pledges')).body.items as PledgeView[])[0]!;
    const count = await Blanket.count();
    const res = await vol.post('/api/blankets', { ...goodPreemie, pledgeId: theirs.id });
    expect(res.status).toBe(404);
    expect(res.body.error.issues[0].path).toBe('pledgeId');
    expect(await Blanket.count()).toBe(count);
  });

  it('refuses a blanket beyond what the pledge promised, and one under a cancelled pledge', async () => {
    const p = await preemiePledge(vol, 1);
    await logBlanket(vol, p.id);
    const full = await vol.post('/api/blankets', { ...goodPreemie, pledgeId: p.id });
    expect(full.status).toBe(409);
    expect(full.body.error.message).toMatch(/raise the pledge/);

    const q = await preemiePledge(vol, 1);
    await vol.delete(`/api/pledges/${q.id}`);
    const cancelled = await vol.post('/api/blankets', { ...goodPreemie, pledgeId: q.id });
    expect(cancelled.status).toBe(409);
    expect(cancelled.body.error.issues[0].path).toBe('pledgeId');
  });

  it("accepts one of the maker's own saved plans and refuses anyone else's", async () => {
    const me = await User.findOne({ where: { email: 'volunteer@example.org' } });
    const them = await User.findOne({ where: { email: 'maren@example.org' } });
    const mine = await Plan.create({ userId: me!.id, name: 'Preemie square', input: {} });
    const theirs = await Plan.create({ userId: them!.id, name: 'Their plan', input: {} });
    const p = await preemiePledge(vol, 2);
    const ok = await logBlanket(vol, p.id, { planId: mine.id });
    expect(ok.planId).toBe(mine.id);
    const res = await vol.post('/api/blankets', { ...goodPreemie, pledgeId: p.id, planId: theirs.id });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('planId');
  });

  it('fulfils the pledge once enough of its blankets are finished', async () => {
    const p = await preemiePledge(vol, 2);
    await logBlanket(vol, p.id, { status: 'finished' });
    expect((await Pledge.findByPk(p.id))!.status).toBe('active');
    const second = await logBlanket(vol, p.id);
    expect((await Pledge.findByPk(p.id))!.status).toBe('active');
    await vol.patch(`/api/blankets/${second.id}`, { status: 'finished' });
    expect((await Pledge.findByPk(p.id))!.status).toBe('fulfilled');
  });
});

describe('blanket ownership', () => {
  let marens: BlanketSummary;
  beforeAll(async () => {
    marens = ((await maren.get('/api/blankets')).body.items as BlanketSummary[])[0]!;
  });

  it("answers 404 to a volunteer for someone else's blanket, and changes nothing", async () => {
    expect((await vol.get(`/api/blankets/${marens.id}`)).status).toBe(404);
    const res = await vol.patch(`/api/blankets/${marens.id}`, { colours: 'mine now' });
    expect(res.status).toBe(404);
    expect((await Blanket.findByPk(marens.id))!.colours).toBe(marens.colours);
  });

  it("lists only a volunteer's own blankets", async () => {
    const me = await User.findOne({ where: { email: 'volunteer@example.org' } });
    const list = (await vol.get('/api/blankets')).body.items as BlanketSummary[];
    expect(list.length).toBeGreaterThan(0);
    expect(list.every((b) => b.userId === me!.id)).toBe(true);
  });

  it("lets organisers and coordinators read every blanket, with the maker's name", async () => {
    const res = await organiser.get('/api/blankets?pageSize=100');
    const all = res.body.items as BlanketSummary[];
    expect(res.body.total).toBe(await Blanket.count());
    expect(all.length).toBe(Math.min(100, res.body.total));
    expect(all.find((b) => b.id === marens.id)?.makerName).toBe('Maren Oakley');
    expect((await coordinator.get(`/api/blankets/${marens.id}`)).status).toBe(200);
    expect((await organiser.get('/api/blankets?mine=1')).body.items).toEqual([]);
  });

  it('filters the list by status', async () => {
    const booked = (await organiser.get('/api/blankets?status=booked')).body.items as BlanketSummary[];
    expect(booked.length).toBeGreaterThan(0);
    expect(booked.every((b) => b.status === 'booked')).toBe(true);
    expect((await organiser.get('/api/blankets?status=lost')).status).toBe(400);
  });

  it('needs a signed-in user', async () => {
    expect((await request(t.app).get('/api/blankets')).status).toBe(401);
    expect((await request(t.app).get(`/api/blankets/${marens.id}`)).status).toBe(401);
  });
});

describe('PATCH /api/blankets/:id: the log', () => {
  it('lets the maker fix what the self-check caught, and the check then passes', async () => {
    const p = await preemiePledge(vol, 1);
    const b = await logBlanket(vol, p.id, { features: ['fringe', 'pompoms'] });
    expect(b.selfCheck!.reasons.map((r) => r.rule).sort()).toEqual(['feature.fringe', 'feature.pompoms']);
    const res = await vol.patch(`/api/blankets/${b.id}`, { features: [], version: b.version });
    expect(res.status).toBe(200);
    expect(res.body.blanket.selfCheck).toMatchObject({ ok: true, verdict: 'ready' });
    expect(res.body.blanket.features).toEqual([]);
    // Fields left out of the update stay as they were.
    expect(res.body.blanket).toMatchObject({ dryerSafe: true, colours: 'sage and cream', widthCm: 45 });
    const edit = (res.body.blanket as BlanketDetail).events.find((e) => e.kind === 'edited')!;
    expect(edit.data).toMatchObject({ fields: ['features'], before: { features: ['fringe', 'pompoms'] } });
  });

  it('refuses bad values with the field named, leaving the blanket as it was', async () => {
    const p = await preemiePledge(vol, 1);
    const b = await logBlanket(vol, p.id);
    for (const [body, field] of [
      [{ widthCm: 0 }, 'widthCm'],
      [{ lengthCm: 1000 }, 'lengthCm'],
      [{ yarnWeight: -1 }, 'yarnWeight'],
      [{ features: ['sequins'] }, 'features.0'],
      [{ status: 'lost' }, 'status'],
    ] as Array<[Record<string, unknown>, string]>) {
      const res = await vol.patch(`/api/blankets/${b.id}`, body);
      expect(res.status).toBe(400);
      expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain(field);
    }
    const after = await Blanket.findByPk(b.id);
    expect(after!.widthCm).toBe(45);
    expect(after!.version).toBe(b.version);
  });

  it('records only the fields that changed when a form sends them all', async () => {
    const p = await preemiePledge(vol, 1);
    const b = await logBlanket(vol, p.id);
    const res = await vol.patch(`/api/blankets/${b.id}`, { ...goodPreemie, yarnWeight: 2 });
    expect(res.status).toBe(200);
    const edit = (res.body.blanket as BlanketDetail).events.find((e) => e.kind === 'edited')!;
    expect(edit.data).toMatchObject({ fields: ['yarnWeight'], before: { yarnWeight: 3 } });
    const same = await vol.patch(`/api/blankets/${b.id}`, { ...goodPreemie, yarnWeight: 2 });
    expect(same.status).toBe(200);
    expect((same.body.blanket as BlanketDetail).events.filter((e) => e.kind === 'edited')).toHaveLength(1);
  });

  it('refuses a stale version with 409', async () => {
    const p = await preemiePledge(vol, 1);
    const b = await logBlanket(vol, p.id);
    await vol.patch(`/api/blankets/${b.id}`, { colours: 'first edit', version: b.version });
    const res = await vol.patch(`/api/blankets/${b.id}`, { colours: 'second edit', version: b.version });
    expect(res.status).toBe(409);
    expect((await Blanket.findByPk(b.id))!.colours).toBe('first edit');
  });

  it('refuses an empty change, and a reason without a status', async () => {
    const p = await preemiePledge(vol, 1);
    const b = await logBlanket(vol, p.id);
    expect((await vol.patch(`/api/blankets/${b.id}`, {})).status).toBe(400);
    const r = await vol.patch(`/api/blankets/${b.id}`, { reason: 'just because' });
    expect(r.status).toBe(400);
    expect(r.body.error.issues[0].path).toBe('reason');
  });

  it("does not let organisers rewrite a maker's log (403)", async () => {
    const p = await preemiePledge(vol, 1);
    const b = await logBlanket(vol, p.id);
    expect((await organiser.patch(`/api/blankets/${b.id}`, { widthCm: 50 })).status).toBe(403);
    expect((await Blanket.findByPk(b.id))!.widthCm).toBe(45);
  });

  it('freezes the log once the organisers have the blanket', async () => {
    const p = await preemiePledge(vol, 1);
    const b = await logBlanket(vol, p.id, { status: 'finished' });
    expect((await bookDropOff(vol, b.id)).status).toBe(201);
    expect((await moveTo(organiser, b.id, 'received')).status).toBe(200);
    const res = await vol.patch(`/api/blankets/${b.id}`, { widthCm: 44 });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/organisers/);
  });
});

/** Receiving and inspecting go through intake, which records the re-measure and the check; the rest is a status change. */
async function moveTo(who: Client, id: number, status: string) {
  if (status === 'received') {
    const site = ((await who.get('/api/sites')).body.sites as Array<{ id: number }>)[0]!;
    const b = (await Blanket.findByPk(id))!;
    return who.post(`/api/blankets/${id}/intake`, { siteId: site.id, widthCm: b.widthCm, lengthCm: b.lengthCm });
  }
  if (status === 'checked') return who.post(`/api/blankets/${id}/inspection`, { checklist: ALL_GOOD, outcome: 'checked' });
  if (status === 'booked') return bookDropOff(who, id);
  if (status === 'assigned') {
    const b = (await Blanket.findByPk(id))!;
    const needId = (await Pledge.findByPk(b.pledgeId!))!.needId!;
    return who.post('/api/assignments', { blanketId: id, needId });
  }
  return who.patch(`/api/blankets/${id}`, { status });
}

/** Booking goes through a drop-off booking, which records the site and the slot: the soonest one free. */
async function bookDropOff(who: Client, id: number) {
  const slot = ((await who.get('/api/slots/soonest?limit=1')).body.soonest as Array<{ siteId: number; start: string }>)[0]!;
  return who.post('/api/bookings', { siteId: slot.siteId, start: slot.start, blanketIds: [id] });
}

describe('PATCH /api/blankets/:id: status moves', () => {
  it('refuses receiving or inspecting by a bare status change: those go through intake (409)', async () => {
    const p = await preemiePledge(vol, 1);
    const b = await logBlanket(vol, p.id, { status: 'finished' });
    expect((await bookDropOff(vol, b.id)).status).toBe(201);
    const res = await organiser.patch(`/api/blankets/${b.id}`, { status: 'received' });
    expect(res.status).toBe(409);
    expect(res.body.error.issues[0].path).toBe('status');
    expect((await Blanket.findByPk(b.id))!.status).toBe('booked');
    const detail = (await organiser.get(`/api/blankets/${b.id}`)).body.blanket as BlanketDetail;
    expect(detail.moves.map((m) => m.to)).not.toContain('received');
    expect(detail.atIntake).toBe(true);
  });

  it('takes a blanket from the hook to delivery, each step by the right person, recorded with who and when', async () => {
    const p = await preemiePledge(vol, 1);
    const b = await logBlanket(vol, p.id);
    const steps: Array<[Client, string]> = [
      [vol, 'finished'],
      [vol, 'booked'],
      [organiser, 'received'],
      [organiser, 'checked'],
      [organiser, 'assigned'],
    ];
    for (const [who, status] of steps) {
      const res = await moveTo(who, b.id, status);
      expect(res.status, `${status}: ${JSON.stringify(res.body)}`).toBe(status === 'booked' || status === 'assigned' ? 201 : 200);
      expect((await Blanket.findByPk(b.id))!.status).toBe(status);
    }
    const detail = (await vol.get(`/api/blankets/${b.id}`)).body.blanket as BlanketDetail;
    const moves = detail.events.filter((e) => ['status', 'booking', 'intake', 'inspection', 'assignment'].includes(e.kind));
    expect(moves.map((e) => [e.fromStatus, e.toStatus, e.actor?.name])).toEqual([
      ['in_progress', 'finished', 'Wren Calloway'],
      ['finished', 'booked', 'Wren Calloway'],
      ['booked', 'received', 'Odile Farrant'],
      ['received', 'checked', 'Odile Farrant'],
      ['checked', 'assigned', 'Odile Farrant'],
    ]);
    // Packing and delivering happen on a delivery run, which records the stop and box with the move.
    const pack = await organiser.patch(`/api/blankets/${b.id}`, { status: 'packed' });
    expect(pack.status).toBe(409);
    expect(pack.body.error.message).toMatch(/delivery run/);
    expect(moves.every((e) => !Number.isNaN(Date.parse(e.createdAt)))).toBe(true);
    expect(detail.receivedAt).not.toBeNull();
  });

  it('refuses to skip a step (409) and leaves the status alone', async () => {
    const p = await preemiePledge(vol, 1);
    const b = await logBlanket(vol, p.id);
    const res = await vol.patch(`/api/blankets/${b.id}`, { status: 'booked' });
    expect(res.status).toBe(409);
    expect(res.body.error.issues[0].path).toBe('status');
    expect((await Blanket.findByPk(b.id))!.status).toBe('in_progress');
  });

  it('refuses to go back without a reason, and records the reason when given', async () => {
    const p = await preemiePledge(vol, 1);
    const b = await logBlanket(vol, p.id, { status: 'finished' });
    const none = await vol.patch(`/api/blankets/${b.id}`, { status: 'in_progress' });
    expect(none.status).toBe(400);
    expect(none.body.error.issues[0].path).toBe('reason');
    const blank = await vol.patch(`/api/blankets/${b.id}`, { status: 'in_progress', reason: '   ' });
    expect(blank.status).toBe(400);
    const ok = await vol.patch(`/api/blankets/${b.id}`, { status: 'in_progress', reason: 'Found a hole near the corner' });
    expect(ok.status).toBe(200);
    const last = (ok.body.blanket as BlanketDetail).events.at(-1)!;
    expect(last).toMatchObject({ fromStatus: 'finished', toStatus: 'in_progress', reason: 'Found a hole near the corner' });
  });

  it("refuses a move that is not the person's to make (403)", async () => {
    const p = await preemiePledge(vol, 1);
    const b = await logBlanket(vol, p.id, { status: 'finished' });
    expect((await organiser.patch(`/api/blankets/${b.id}`, { status: 'booked' })).status).toBe(403);
    expect((await bookDropOff(vol, b.id)).status).toBe(201);
    const own = await vol.patch(`/api/blankets/${b.id}`, { status: 'received' });
    expect(own.status).toBe(403);
    expect(own.body.error.message).toMatch(/organisers/);
    await moveTo(organiser, b.id, 'received');
    await moveTo(organiser, b.id, 'checked');
    await moveTo(organiser, b.id, 'assigned');
    expect((await Blanket.findByPk(b.id))!.status).toBe('assigned');
  });

  it('sends booking and cancelling a drop-off to the booking, which records the site and slot (409)', async () => {
    const p = await preemiePledge(vol, 1);
    const b = await logBlanket(vol, p.id, { status: 'finished' });
    const nowhere = await vol.patch(`/api/blankets/${b.id}`, { status: 'booked', siteId: 9999 });
    expect(nowhere.status).toBe(400);
    expect(nowhere.body.error.issues[0].path).toBe('siteId');
    const bare = await vol.patch(`/api/blankets/${b.id}`, { status: 'booked', siteId: (await Site.findOne())!.id });
    expect(bare.status).toBe(409);
    expect(bare.body.error.issues[0].path).toBe('status');
    expect(bare.body.error.message).toMatch(/drop-off booking page/);
    expect((await Blanket.findByPk(b.id))!.status).toBe('finished');
    expect((await bookDropOff(vol, b.id)).status).toBe(201);
    const back = await vol.patch(`/api/blankets/${b.id}`, { status: 'finished', reason: 'Plans changed' });
    expect(back.status).toBe(409);
    expect((await Blanket.findByPk(b.id))!.status).toBe('booked');
  });

  it('offers each person only the moves they can make', async () => {
    const booked = ((await vol.get('/api/blankets')).body.items as BlanketSummary[]).find((b) => b.status === 'booked')!;
    const mine = (await vol.get(`/api/blankets/${booked.id}`)).body.blanket as BlanketDetail;
    // Cancelling is done on the drop-off booking page, which frees the slot with it.
    expect(mine.moves).toEqual([]);
    const theirs = (await organiser.get(`/api/blankets/${booked.id}`)).body.blanket as BlanketDetail;
    // Receiving it is the organisers' next step, taken on the intake page rather than by a button here.
    expect(theirs.moves.map((m) => m.to)).toEqual([]);
    expect(theirs.atIntake).toBe(true);
    expect(mine.atIntake).toBe(false);
    expect(theirs.editable).toBe(false);
  });
});

describe('blanket codes', () => {
  it('tries again when a random code is already taken', async () => {
    const taken = (await Blanket.findOne())!.code;
    const bytesOf = (code: string) => Uint8Array.from(code.slice(CODE_PREFIX.length), (c) => CODE_ALPHABET.indexOf(c));
    const fresh = 'KL-ZZZZ';
    expect(await Blanket.count({ where: { code: fresh } })).toBe(0);
    const answers = [bytesOf(taken), bytesOf(taken), bytesOf(fresh)];
    let calls = 0;
    const code = await uniqueBlanketCode(undefined, () => answers[calls++]!);
    expect(code).toBe(fresh);
    expect(calls).toBe(3);
  });

  it('gives up loudly rather than loop for ever when every try collides', async () => {
    const taken = (await Blanket.findOne())!.code;
    const bytes = Uint8Array.from(taken.slice(CODE_PREFIX.length), (c) => CODE_ALPHABET.indexOf(c));
    await expect(uniqueBlanketCode(undefined, () => bytes)).rejects.toThrow(/No free blanket code/);
  });

  it('gives every blanket a different code', async () => {
    const codes = (await Blanket.findAll({ attributes: ['code'] })).map((b) => b.code);
    expect(new Set(codes).size).toBe(codes.length);
    expect(codes.every(isBlanketCode)).toBe(true);
  });
});
