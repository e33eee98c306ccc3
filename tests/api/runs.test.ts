import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Blanket } from '../../server/db/models/blanket';
import { BlanketEvent } from '../../server/db/models/blanket-event';
import { Recipient } from '../../server/db/models/recipient';
import { RunBlanket } from '../../server/db/models/run';
import { Site } from '../../server/db/models/site';
import { User } from '../../server/db/models/user';
import type { RunView, WaitingRecipient } from '@shared/schemas/run';
import { assignedBlanket } from '../fixtures/runs';

const RACERS = 20;

let t: TestApp;
let coordinator: Client;
let organiser: Client;
let maker: User;
let driver: User;
let site: Site;
let recipients: Record<'newborn' | 'shelter' | 'care' | 'hospice' | 'ward', Recipient>;

const today = new Date().toISOString().slice(0, 10);

beforeAll(async () => {
  t = await makeTestApp();
  coordinator = await signedIn(t.app, 'coordinator');
  organiser = await signedIn(t.app, 'organiser');
  maker = (await User.findOne({ where: { email: 'maren@example.org' } }))!;
  driver = (await User.findOne({ where: { email: 'organiser@example.org' } }))!;
  site = (await Site.findOne({ where: { name: 'Millrace Community Hall' } }))!;
  const byKind = async (kind: string) => (await Recipient.findOne({ where: { kind } }))!;
  recipients = {
    newborn: await byKind('neonatal-unit'),
    shelter: await byKind('family-shelter'),
    care: (await Recipient.findOne({ where: { name: 'Tansy Court Care Home' } }))!,
    hospice: await byKind('hospice'),
    ward: await byKind('childrens-ward'),
  };
});
afterAll(async () => t.close());

async function newRun(recipientIds: number[] = [], driverId = driver.id): Promise<RunView> {
  const res = await coordinator.post('/api/runs', { runDate: today, driverId, startSiteId: site.id, recipientIds });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.run as RunView;
}

type Res = { status: number; body: { error?: { message?: string } } };
function expectRace(results: Res[], winners: number, winStatus: number) {
  const by = new Map<number, number>();
  for (const r of results) by.set(r.status, (by.get(r.status) ?? 0) + 1);
  expect([...by.keys()].filter((s) => s >= 500), `server errors in ${JSON.stringify([...by])}`).toEqual([]);
  expect(by.get(winStatus) ?? 0, JSON.stringify([...by])).toBe(winners);
  expect(by.get(409) ?? 0).toBe(results.length - winners);
  for (const r of results.filter((x) => x.status === 409)) {
    expect(r.body.error?.message ?? '').toMatch(/[a-z]{3,} [a-z]{2,}/i);
    expect(r.body.error?.message ?? '').not.toMatch(/SQLITE|constraint|sequelize/i);
  }
}

describe('planning a run', () => {
  it("takes each stop's assigned blankets that no run carries, and they leave the waiting list", async () => {
    const a = await assignedBlanket(maker.id, recipients.shelter.id);
    const b = await assignedBlanket(maker.id, recipients.shelter.id);
    const c = await assignedBlanket(maker.id, recipients.care.id);
    const before = (await organiser.get('/api/runs/waiting')).body.recipients as WaitingRecipient[];
    expect(before.find((r) => r.id === recipients.shelter.id)?.waiting).toBeGreaterThanOrEqual(2);
    const run = await newRun([recipients.shelter.id, recipients.care.id]);
    expect(run.stops.map((s) => s.recipient.id)).toEqual([recipients.shelter.id, recipients.care.id]);
    const ids = run.stops.flatMap((s) => s.blankets.map((x) => x.id));
    expect(ids).toEqual(expect.arrayContaining([a.id, b.id, c.id]));
    expect(run.state).toBe('planned');
    expect(run.driver.id).toBe(driver.id);
    const after = (await organiser.get('/api/runs/waiting')).body.recipients as WaitingRecipient[];
    expect(after.find((r) => r.id === recipients.shelter.id)).toBeUndefined();
    // The run shows each leg and the round trip, from the start site and back.
    expect(run.stops.every((s) => typeof s.legKm === 'number' && s.legKm > 0)).toBe(true);
    expect(run.totalKm).toBeCloseTo(run.stops.reduce((n, s) => n + s.legKm!, 0) + run.returnKm!, 9);
  });

  it('refuses a driver, site or recipient that does not exist (400), and a stop with nothing waiting (409)', async () => {
    const bad = await coordinator.post('/api/runs', { runDate: today, driverId: 999999, startSiteId: site.id });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe('driverId');
    const noSite = await coordinator.post('/api/runs', { runDate: today, driverId: driver.id, startSiteId: 999999 });
    expect(noSite.body.error.issues[0].path).toBe('startSiteId');
    const date = await coordinator.post('/api/runs', { runDate: '2026-02-30', driverId: driver.id, startSiteId: site.id });
    expect(date.status).toBe(400);
    const twice = await coordinator.post('/api/runs', { runDate: today, driverId: driver.id, startSiteId: site.id, recipientIds: [1, 1] });
    expect(twice.status).toBe(400);
    const nothing = await coordinator.post('/api/runs', { runDate: today, driverId: driver.id, startSiteId: site.id, recipientIds: [recipients.hospice.id] });
    expect(nothing.status).toBe(409);
    expect(nothing.body.error.message).toMatch(/no assigned blankets waiting/);
  });

  it('suggests a stop order, takes a hand-made order, and refuses an order that is not the run\'s stops', async () => {
    for (const r of [recipients.newborn, recipients.ward, recipients.hospice]) await assignedBlanket(maker.id, r.id);
    const run = await newRun([recipients.hospice.id, recipients.newborn.id, recipients.ward.id]);
    const routed = (await coordinator.post(`/api/runs/${run.id}/route`)).body.run as RunView;
    expect(routed.stops).toHaveLength(3);
    expect(routed.totalKm).toBeLessThanOrEqual(run.totalKm! + 1e-9);
    const reversed = routed.stops.map((s) => s.id).reverse();
    const patched = await coordinator.patch(`/api/runs/${run.id}`, { stopOrder: reversed, version: routed.version });
    expect(patched.status).toBe(200);
    expect((patched.body.run as RunView).stops.map((s) => s.id)).toEqual(reversed);
    // The same round trip driven backwards is as long.
    expect((patched.body.run as RunView).totalKm).toBeCloseTo(routed.totalKm!, 9);
    const stale = await coordinator.patch(`/api/runs/${run.id}`, { notes: 'x', version: routed.version });
    expect(stale.status).toBe(409);
    const wrong = await coordinator.patch(`/api/runs/${run.id}`, { stopOrder: reversed.slice(1) });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.issues[0].path).toBe('stopOrder');
  });

  it('shows the cautions where blankets go to infants or frail people, with the facility policy first', async () => {
    await assignedBlanket(maker.id, recipients.newborn.id);
    await assignedBlanket(maker.id, recipients.care.id);
    const run = await newRun([recipients.newborn.id, recipients.care.id]);
    const [newborn, care] = run.stops;
    expect(newborn!.cautions.map((c) => c.id)).toEqual(expect.arrayContaining(['infant.supervised-only', 'infant.small-parts', 'facility-policy']));
    expect(care!.cautions.map((c) => c.id)).toEqual(expect.arrayContaining(['elder.no-trailing-fringe', 'facility-policy']));
  });
});

describe('packing and delivering', () => {
  it('packs a stop into boxes, delivers it with who signed, and records each move in the history', async () => {
    const a = await assignedBlanket(maker.id, recipients.shelter.id);
    const b = await assignedBlanket(maker.id, recipients.shelter.id);
    // Driven by a maker who offered a car: the organiser at the desk packs, but does not record the hand-over.
    const run = await newRun([recipients.shelter.id], maker.id);
    const stop = run.stops[0]!;
    const packed = await organiser.post(`/api/runs/${run.id}/stops/${stop.id}/packed`, { boxes: [{ blanketId: b.id, box: 2 }] });
    expect(packed.status, JSON.stringify(packed.body)).toBe(200);
    const ps = (packed.body.run as RunView).stops[0]!;
    expect(ps.state).toBe('packed');
    expect(ps.boxes).toEqual([1, 2]);
    expect((await Blanket.findByPk(a.id))!.status).toBe('packed');
    const ev = await BlanketEvent.findOne({ where: { blanketId: b.id, toStatus: 'packed' } });
    expect(ev).toMatchObject({ kind: 'packing' });
    expect(ev!.data).toMatchObject({ runId: run.id, stopId: stop.id, box: 2 });

    // Delivering is recorded by a coordinator or by the run's driver; an organiser who does not drive it is refused.
    const byOrganiser = await organiser.post(`/api/runs/${run.id}/stops/${stop.id}/delivered`, { receivedCount: 2, signedBy: 'Desk' });
    expect(byOrganiser.status).toBe(403);
    expect(byOrganiser.body.error.message).toMatch(/driver of this run or a coordinator/);
    expect((await Blanket.findByPk(a.id))!.status).toBe('packed');
    const missing = await coordinator.post(`/api/runs/${run.id}/stops/${stop.id}/delivered`, { receivedCount: 2 });
    expect(missing.status).toBe(400);
    expect(missing.body.error.issues[0].path).toBe('signedBy');
    const done = await coordinator.post(`/api/runs/${run.id}/stops/${stop.id}/delivered`, { receivedCount: 2, signedBy: 'The shelter office' });
    expect(done.status).toBe(200);
    const ds = (done.body.run as RunView).stops[0]!;
    expect(ds).toMatchObject({ state: 'delivered', receivedCount: 2, signedBy: 'The shelter office' });
    expect((done.body.run as RunView).state).toBe('delivered');
    expect((await Blanket.findByPk(b.id))!.status).toBe('delivered');
    expect(await BlanketEvent.findOne({ where: { blanketId: b.id, toStatus: 'delivered', kind: 'delivery' } })).not.toBeNull();
  });

  it('the organiser who drives the run records its deliveries, and can undo one', async () => {
    const a = await assignedBlanket(maker.id, recipients.shelter.id);
    const run = await newRun([recipients.shelter.id], driver.id);
    const stop = run.stops[0]!;
    expect((await organiser.post(`/api/runs/${run.id}/stops/${stop.id}/packed`, {})).status).toBe(200);
    const done = await organiser.post(`/api/runs/${run.id}/stops/${stop.id}/delivered`, { receivedCount: 1, signedBy: 'Family room' });
    expect(done.status, JSON.stringify(done.body)).toBe(200);
    expect((await Blanket.findByPk(a.id))!.status).toBe('delivered');
    const ev = await BlanketEvent.findOne({ where: { blanketId: a.id, toStatus: 'delivered' } });
    expect(ev!.actorId).toBe(driver.id);
    const undo = await organiser.delete(`/api/runs/${run.id}/stops/${stop.id}/delivered`).send({ reason: 'Counted at the wrong door' });
    expect(undo.status, JSON.stringify(undo.body)).toBe(200);
    expect((await Blanket.findByPk(a.id))!.status).toBe('packed');
  });

  it('steps back only with a reason: undo a delivery, then unpack', async () => {
    const a = await assignedBlanket(maker.id, recipients.care.id);
    const run = await newRun([recipients.care.id]);
    const stop = run.stops[0]!;
    await organiser.post(`/api/runs/${run.id}/stops/${stop.id}/packed`, {});
    expect((await organiser.delete(`/api/runs/${run.id}/stops/${stop.id}/packed`).send({})).status).toBe(400);
    await coordinator.post(`/api/runs/${run.id}/stops/${stop.id}/delivered`, { receivedCount: 1, signedBy: 'Matron' });
    const unpackDelivered = await organiser.delete(`/api/runs/${run.id}/stops/${stop.id}/packed`).send({ reason: 'wrong stop' });
    expect(unpackDelivered.status).toBe(409);
    const undo = await coordinator.delete(`/api/runs/${run.id}/stops/${stop.id}/delivered`).send({ reason: 'Marked on the wrong stop' });
    expect(undo.status).toBe(200);
    expect((await Blanket.findByPk(a.id))!.status).toBe('packed');
    const unpack = await organiser.delete(`/api/runs/${run.id}/stops/${stop.id}/packed`).send({ reason: 'Box was damp; repack tomorrow' });
    expect(unpack.status).toBe(200);
    expect((await Blanket.findByPk(a.id))!.status).toBe('assigned');
    const back = await BlanketEvent.findOne({ where: { blanketId: a.id, fromStatus: 'packed', toStatus: 'assigned' } });
    expect(back!.reason).toBe('Box was damp; repack tomorrow');
  });

  it('refuses to deliver an unpacked stop, to take a packed blanket off, or to remove a packed stop (409)', async () => {
    const a = await assignedBlanket(maker.id, recipients.ward.id);
    const run = await newRun([recipients.ward.id]);
    const stop = run.stops[0]!;
    expect((await coordinator.post(`/api/runs/${run.id}/stops/${stop.id}/delivered`, { receivedCount: 1, signedBy: 'X' })).status).toBe(409);
    await organiser.post(`/api/runs/${run.id}/stops/${stop.id}/packed`, {});
    expect((await coordinator.delete(`/api/runs/${run.id}/blankets/${a.id}`)).status).toBe(409);
    expect((await coordinator.delete(`/api/runs/${run.id}/stops/${stop.id}`)).status).toBe(409);
    const notOnStop = await organiser.post(`/api/runs/${run.id}/stops/${stop.id}/packed`, { boxes: [{ blanketId: 999999, box: 1 }] });
    expect(notOnStop.status).toBe(409); // already packed comes first
  });

  it('a box for a blanket that is not on the stop is refused with the field named (400)', async () => {
    await assignedBlanket(maker.id, recipients.ward.id);
    const run = await newRun([recipients.ward.id]);
    const res = await organiser.post(`/api/runs/${run.id}/stops/${run.stops[0]!.id}/packed`, { boxes: [{ blanketId: 999999, box: 1 }] });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('boxes.0.blanketId');
    expect((await coordinator.get(`/api/runs/${run.id}`)).body.run.stops[0].state).toBe('planned');
  });
});

describe('20 simultaneous writes on runs', () => {
  it('putting one blanket on twenty runs at once: one run gets it, the rest 409', async () => {
    const b = await assignedBlanket(maker.id, recipients.shelter.id);
    const runs = await Promise.all(Array.from({ length: RACERS }, () => newRun()));
    const results = await Promise.all(runs.map((r, i) => (i % 2 ? coordinator : coordinator).post(`/api/runs/${r.id}/blankets`, { blanketId: b.id, box: 1 })));
    expectRace(results, 1, 201);
    expect(await RunBlanket.count({ where: { blanketId: b.id } })).toBe(1);
  });

  it('the same recipient added to twenty runs at once: one takes its blankets, the rest are told nothing is waiting', async () => {
    await assignedBlanket(maker.id, recipients.hospice.id);
    await assignedBlanket(maker.id, recipients.hospice.id);
    const runs = await Promise.all(Array.from({ length: RACERS }, () => newRun()));
    const results = await Promise.all(runs.map((r) => coordinator.post(`/api/runs/${r.id}/stops`, { recipientId: recipients.hospice.id })));
    expectRace(results, 1, 201);
  });

  it('taking one blanket off a run twenty times at once: one removal, the rest 409', async () => {
    const b = await assignedBlanket(maker.id, recipients.newborn.id);
    const run = await newRun();
    expect((await coordinator.post(`/api/runs/${run.id}/blankets`, { blanketId: b.id })).status).toBe(201);
    const results = await Promise.all(Array.from({ length: RACERS }, () => coordinator.delete(`/api/runs/${run.id}/blankets/${b.id}`)));
    expectRace(results, 1, 200);
    expect(await RunBlanket.count({ where: { blanketId: b.id } })).toBe(0);
  });

  it('packing one stop twenty times at once: packed once, each blanket moved once', async () => {
    const b = await assignedBlanket(maker.id, recipients.care.id);
    const run = await newRun([recipients.care.id]);
    const results = await Promise.all(Array.from({ length: RACERS }, (_, i) => (i % 2 ? organiser : coordinator).post(`/api/runs/${run.id}/stops/${run.stops[0]!.id}/packed`, {})));
    expectRace(results, 1, 200);
    expect(await BlanketEvent.count({ where: { blanketId: b.id, toStatus: 'packed' } })).toBe(1);
  });

  it('marking one stop delivered twenty times at once: delivered once', async () => {
    const b = await assignedBlanket(maker.id, recipients.ward.id);
    const run = await newRun([recipients.ward.id]);
    const stop = run.stops[0]!;
    await organiser.post(`/api/runs/${run.id}/stops/${stop.id}/packed`, {});
    const results = await Promise.all(
      Array.from({ length: RACERS }, () => coordinator.post(`/api/runs/${run.id}/stops/${stop.id}/delivered`, { receivedCount: 1, signedBy: 'Ward clerk' })),
    );
    expectRace(results, 1, 200);
    expect(await BlanketEvent.count({ where: { blanketId: b.id, toStatus: 'delivered' } })).toBe(1);
  });
});

describe('the demo', () => {
  it('has a delivered run and an upcoming run packed for several stops', async () => {
    type Items = { items: Array<{ state: string; stopCount: number; runDate: string }>; total: number };
    const past = (await organiser.get('/api/runs?when=past')).body as Items;
    expect(past.items.some((r) => r.state === 'delivered')).toBe(true);
    const upcoming = (await organiser.get('/api/runs?when=upcoming&dir=desc&pageSize=5')).body as Items;
    expect(upcoming.items[0]!.runDate > today).toBe(true);
    expect(upcoming.items.some((r) => r.state === 'packed' && r.stopCount >= 2)).toBe(true);
  });
});
