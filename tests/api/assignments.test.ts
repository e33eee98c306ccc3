import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { InferCreationAttributes } from 'sequelize';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Assignment } from '../../server/db/models/assignment';
import { Blanket } from '../../server/db/models/blanket';
import { BlanketEvent } from '../../server/db/models/blanket-event';
import { Need } from '../../server/db/models/need';
import { Recipient } from '../../server/db/models/recipient';
import { User } from '../../server/db/models/user';
import { needCounts } from '../../server/modules/pledges/need-counts';
import { codeFromBytes } from '@shared/blankets/code';
import { defaultGuidelines } from '@shared/guidelines/defaults';
import type { BlanketFields } from '@shared/schemas/blanket';
import type { AssignmentView, BatchResult, BoardNeed, Suggestion, WaitingBlanket } from '@shared/schemas/assignment';
import type { Page } from '@shared/schemas/page';
import { plainBlanket } from '../fixtures/blankets';

let t: TestApp;
let organiser: Client;
let coordinator: Client;
let maker: User;
let shelter: Recipient;
let ward: Recipient;

let codeCounter = 0;
async function checkedBlanket(over: Partial<BlanketFields> & { measuredWidthCm?: number; measuredLengthCm?: number; status?: string } = {}) {
  const n = codeCounter++;
  return Blanket.create({
    code: codeFromBytes(Uint8Array.from([7, 3, (n >> 5) & 31, n & 31])),
    userId: maker.id,
    recipientId: null,
    status: 'checked',
    colours: 'pale blue',
    ...plainBlanket(),
    ...over,
  } as unknown as InferCreationAttributes<Blanket>);
}

async function needFor(r: Recipient, quantity: number, sizeCategory: 'crib' | 'baby' | 'child' = 'crib') {
  return Need.create({ recipientId: r.id, sizeCategory, quantity, deadline: '2027-01-31', preferences: null });
}

beforeAll(async () => {
  t = await makeTestApp();
  organiser = await signedIn(t.app, 'organiser');
  coordinator = await signedIn(t.app, 'coordinator');
  maker = (await User.findOne({ where: { email: 'volunteer@example.org' } }))!;
  // Two recipients of our own, so the demo's needs and counts stay out of these figures.
  shelter = await Recipient.create({
    name: 'Test Family Rooms',
    kind: 'family-shelter',
    population: 'infant',
    address: '1 Test Lane',
    lat: null,
    lng: null,
    guidelines: { ...defaultGuidelines('infant'), requireDryerSafe: false },
  });
  ward = await Recipient.create({
    name: 'Test Children Ward',
    kind: 'childrens-ward',
    population: 'child',
    address: '2 Test Lane',
    lat: null,
    lng: null,
    guidelines: defaultGuidelines('child'),
  });
});

afterAll(async () => {
  await t.close();
});

describe('POST /api/assignments', () => {
  it('assigns a checked blanket: status assigned, the recipient on the blanket, who and when on the record, a history entry', async () => {
    const need = await needFor(shelter, 5);
    const b = await checkedBlanket();
    const res = await organiser.post('/api/assignments', { blanketId: b.id, needId: need.id });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const a = res.body.assignment as AssignmentView;
    expect(a).toMatchObject({ blanketId: b.id, needId: need.id, recipient: { id: shelter.id, name: shelter.name }, blanketStatus: 'assigned', source: 'board' });
    expect(a.assignedBy?.name).toBe('Odile Farrant');
    expect(Date.now() - Date.parse(a.assignedAt)).toBeLessThan(60_000);
    const after = (await Blanket.findByPk(b.id))!;
    expect(after.status).toBe('assigned');
    expect(after.recipientId).toBe(shelter.id);
    const detail = (await organiser.get(`/api/blankets/${b.id}`)).body.blanket;
    expect(detail.status).toBe('assigned');
    expect(detail.recipientId ?? detail.recipient?.id).toBe(shelter.id);
    const last = await BlanketEvent.findOne({ where: { blanketId: b.id }, order: [['id', 'DESC']] });
    expect(last).toMatchObject({ kind: 'assignment', fromStatus: 'checked', toStatus: 'assigned' });
  });

  it('counts a blanket pledged for wherever needed in the need it was assigned to, in the shared need figures', async () => {
    const need = await needFor(shelter, 4);
    const b = await checkedBlanket();
    expect((await needCounts([need.id])).get(need.id)!.assigned).toBe(0);
    expect((await organiser.post('/api/assignments', { blanketId: b.id, needId: need.id })).status).toBe(201);
    expect((await needCounts([need.id])).get(need.id)!.assigned).toBe(1);
  });

  it('refuses a bare status change to assigned (409) and sends the person to the board', async () => {
    const b = await checkedBlanket();
    const res = await organiser.patch(`/api/blankets/${b.id}`, { status: 'assigned' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/assignment board/);
    expect((await Blanket.findByPk(b.id))!.status).toBe('checked');
  });

  it('checks the measured size, not the logged one: a blanket logged crib-sized but measured too large is refused with the rule named (400)', async () => {
    const need = await needFor(shelter, 5);
    const b = await checkedBlanket({ measuredWidthCm: 150, measuredLengthCm: 200 });
    const res = await organiser.post('/api/assignments', { blanketId: b.id, needId: need.id });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/Test Family Rooms does not take blanket/);
    expect(res.body.error.message).toMatch(/cm/);
    expect((await Blanket.findByPk(b.id))!.status).toBe('checked');
    expect(await Assignment.count({ where: { blanketId: b.id } })).toBe(0);
  });

  it('refuses a fibre the recipient refuses, naming it', async () => {
    const need = await needFor(shelter, 5);
    const b = await checkedBlanket({ fibres: ['wool'] });
    const res = await organiser.post('/api/assignments', { blanketId: b.id, needId: need.id });
    expect(res.status).toBe(400);
    expect(res.body.error.message.toLowerCase()).toMatch(/wool/);
  });

  it('never over-fills a need (409 once it is full)', async () => {
    const need = await needFor(shelter, 1);
    const first = await checkedBlanket();
    const second = await checkedBlanket();
    expect((await organiser.post('/api/assignments', { blanketId: first.id, needId: need.id })).status).toBe(201);
    const res = await organiser.post('/api/assignments', { blanketId: second.id, needId: need.id });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/full: 1 of 1/);
  });

  it('refuses a blanket that is not checked (409), and bad input with the field named (400)', async () => {
    const need = await needFor(shelter, 5);
    const received = await checkedBlanket({ status: 'received' } as never);
    const res = await organiser.post('/api/assignments', { blanketId: received.id, needId: need.id });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/only a checked blanket/);
    const bad = await organiser.post('/api/assignments', { blanketId: 'seven', needId: need.id });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe('blanketId');
    const nowhere = await organiser.post('/api/assignments', { blanketId: received.id + 100000, needId: need.id });
    expect(nowhere.status).toBe(400);
    expect(nowhere.body.error.issues[0].path).toBe('blanketId');
    const noNeed = await organiser.post('/api/assignments', { blanketId: (await checkedBlanket()).id, needId: 999999 });
    expect(noNeed.status).toBe(400);
    expect(noNeed.body.error.issues[0].path).toBe('needId');
  });
});

describe('moving and unassigning', () => {
  it('moves an assigned blanket to another recipient\'s need: the old assignment ends, the blanket follows', async () => {
    const here = await needFor(shelter, 5);
    const there = await needFor(ward, 5, 'child');
    const b = await checkedBlanket({ widthCm: 100, lengthCm: 140 });
    // Child-sized: the shelter's infant guidelines refuse it, the ward takes it.
    expect((await organiser.post('/api/assignments', { blanketId: b.id, needId: here.id })).status).toBe(400);
    const crib = await checkedBlanket();
    const first = (await organiser.post('/api/assignments', { blanketId: crib.id, needId: here.id })).body.assignment as AssignmentView;
    const refused = await organiser.patch(`/api/assignments/${first.id}`, { needId: there.id });
    // A crib blanket is smaller than the ward's smallest: the move is checked like an assign.
    expect(refused.status).toBe(400);
    const bigEnough = (await organiser.post('/api/assignments', { blanketId: b.id, needId: there.id })).body.assignment as AssignmentView;
    const other = await needFor(ward, 2, 'child');
    const moved = await coordinator.patch(`/api/assignments/${bigEnough.id}`, { needId: other.id, reason: 'The second need is due first' });
    expect(moved.status, JSON.stringify(moved.body)).toBe(200);
    expect(moved.body.assignment).toMatchObject({ needId: other.id, recipient: { id: ward.id } });
    expect((await Assignment.findByPk(bigEnough.id))!.endedAt).not.toBeNull();
    expect((await Blanket.findByPk(b.id))!).toMatchObject({ status: 'assigned', recipientId: ward.id });
    const same = await coordinator.patch(`/api/assignments/${moved.body.assignment.id}`, { needId: other.id });
    expect(same.status).toBe(409);
    const ended = await coordinator.patch(`/api/assignments/${bigEnough.id}`, { needId: there.id });
    expect(ended.status).toBe(409);
  });

  it('unassigns with a reason only, back to checked, where it was meant to go before', async () => {
    const need = await needFor(shelter, 5);
    const b = await checkedBlanket();
    await b.update({ recipientId: ward.id });
    const a = (await organiser.post('/api/assignments', { blanketId: b.id, needId: need.id })).body.assignment as AssignmentView;
    const none = await organiser.delete(`/api/assignments/${a.id}`).send({});
    expect(none.status).toBe(400);
    expect(none.body.error.issues[0].path).toBe('reason');
    const ok = await organiser.delete(`/api/assignments/${a.id}`).send({ reason: 'The shelter asked for fewer' });
    expect(ok.status).toBe(200);
    expect((await Blanket.findByPk(b.id))!).toMatchObject({ status: 'checked', recipientId: ward.id });
    const last = await BlanketEvent.findOne({ where: { blanketId: b.id }, order: [['id', 'DESC']] });
    expect(last).toMatchObject({ fromStatus: 'assigned', toStatus: 'checked', reason: 'The shelter asked for fewer' });
    const again = await organiser.delete(`/api/assignments/${a.id}`).send({ reason: 'twice' });
    expect(again.status).toBe(409);
    // Free again: it can be assigned anew, and the need counts only the live one.
    expect((await organiser.post('/api/assignments', { blanketId: b.id, needId: need.id })).status).toBe(201);
    expect(await Assignment.count({ where: { needId: need.id, endedAt: null } })).toBe(1);
  });

  it('will not unassign a packed blanket: it must be unpacked first', async () => {
    const need = await needFor(shelter, 5);
    const b = await checkedBlanket();
    const a = (await organiser.post('/api/assignments', { blanketId: b.id, needId: need.id })).body.assignment as AssignmentView;
    await Blanket.update({ status: 'packed' }, { where: { id: b.id } });
    const res = await organiser.delete(`/api/assignments/${a.id}`).send({ reason: 'Changed our minds' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/packed/);
  });
});

describe('POST /api/assignments/batch', () => {
  it('applies what it can in one transaction and reports each pair: assigned, taken meanwhile, or not fitting', async () => {
    const need = await needFor(shelter, 3);
    const [a, b, c, d] = [await checkedBlanket(), await checkedBlanket(), await checkedBlanket({ fibres: ['mohair'] }), await checkedBlanket()];
    // Someone assigns one of them first.
    const other = await needFor(shelter, 5);
    expect((await coordinator.post('/api/assignments', { blanketId: b!.id, needId: other.id })).status).toBe(201);
    const res = await organiser.post('/api/assignments/batch', {
      source: 'suggestion',
      pairs: [a, b, c, d].map((x) => ({ blanketId: x!.id, needId: need.id })),
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const r = res.body as BatchResult;
    expect(r.outcomes.map((o) => o.status)).toEqual([201, 409, 400, 201]);
    expect(r.outcomes[1]!.message).toMatch(/just assigned to Test Family Rooms by Cass Merriweather/);
    expect(r).toMatchObject({ applied: 2, conflicts: 2 });
    expect(r.outcomes[0]!.assignment).toMatchObject({ source: 'suggestion', needId: need.id });
    expect((await Blanket.findByPk(a!.id))!.status).toBe('assigned');
    expect((await Blanket.findByPk(c!.id))!.status).toBe('checked');
    expect(await Assignment.count({ where: { needId: need.id, endedAt: null } })).toBe(2);
  });

  it('stops at the need\'s quantity inside one batch', async () => {
    const need = await needFor(shelter, 2);
    const bs = [await checkedBlanket(), await checkedBlanket(), await checkedBlanket()];
    const r = (await organiser.post('/api/assignments/batch', { pairs: bs.map((x) => ({ blanketId: x.id, needId: need.id })) })).body as BatchResult;
    expect(r.outcomes.map((o) => o.status)).toEqual([201, 201, 409]);
  });

  it('refuses the same blanket twice in one batch, and an empty batch (400)', async () => {
    const need = await needFor(shelter, 2);
    const b = await checkedBlanket();
    const twice = await organiser.post('/api/assignments/batch', { pairs: [{ blanketId: b.id, needId: need.id }, { blanketId: b.id, needId: need.id }] });
    expect(twice.status).toBe(400);
    expect(twice.body.error.issues[0].path).toBe('pairs.1.blanketId');
    expect((await organiser.post('/api/assignments/batch', { pairs: [] })).status).toBe(400);
    expect((await Blanket.findByPk(b.id))!.status).toBe('checked');
  });
});

describe('reading the board', () => {
  it('lists live assignments a page at a time, by need', async () => {
    const need = await needFor(ward, 4, 'child');
    for (let i = 0; i < 3; i++) {
      const b = await checkedBlanket({ widthCm: 100, lengthCm: 140 });
      expect((await organiser.post('/api/assignments', { blanketId: b.id, needId: need.id })).status).toBe(201);
    }
    const page = (await organiser.get(`/api/assignments?needId=${need.id}&pageSize=2`)).body as Page<AssignmentView>;
    expect(page.total).toBe(3);
    expect(page.items).toHaveLength(2);
    expect(page.items.every((a) => a.needId === need.id)).toBe(true);
  });

  it('shows each open need with wanted, assigned and open, and each waiting blanket with where it fits and why not', async () => {
    const need = await needFor(shelter, 2);
    const fits = await checkedBlanket();
    await organiser.post('/api/assignments', { blanketId: fits.id, needId: need.id });
    const needs = (await organiser.get(`/api/assignments/board/needs?recipientId=${shelter.id}`)).body.needs as BoardNeed[];
    const row = needs.find((n) => n.needId === need.id)!;
    expect(row).toMatchObject({ wanted: 2, assigned: 1, open: 1, recipientName: 'Test Family Rooms' });
    expect(row.cautions.length).toBeGreaterThan(0);

    const wool = await checkedBlanket({ fibres: ['wool'] });
    const page = (await organiser.get(`/api/assignments/board/waiting?pageSize=100`)).body as Page<WaitingBlanket>;
    const seen = page.items.find((w) => w.id === wool.id)!;
    const fit = seen.fits.find((f) => f.needId === need.id)!;
    expect(fit.ok).toBe(false);
    expect(fit.reasons.join(' ').toLowerCase()).toMatch(/wool/);
    expect(page.items.some((w) => w.id === fits.id)).toBe(false);
    const small = (await organiser.get('/api/assignments/board/waiting?pageSize=1')).body as Page<WaitingBlanket>;
    expect(small.items).toHaveLength(1);
    expect(small.total).toBe(page.total);
  });
});

describe('POST /api/matching/suggest', () => {
  it('suggests feasible pairs within each need\'s open slots and writes nothing', async () => {
    const before = await Assignment.count();
    const res = await organiser.post('/api/matching/suggest', {});
    expect(res.status).toBe(200);
    const s = res.body as Suggestion;
    expect(s.pairs.length).toBeGreaterThan(0);
    const perNeed = new Map<number, number>();
    for (const p of s.pairs) perNeed.set(p.needId, (perNeed.get(p.needId) ?? 0) + 1);
    const needs = (await organiser.get('/api/assignments/board/needs')).body.needs as BoardNeed[];
    for (const [needId, n] of perNeed) expect(n).toBeLessThanOrEqual(needs.find((x) => x.needId === needId)!.open);
    const waiting = (await organiser.get('/api/assignments/board/waiting?pageSize=100')).body as Page<WaitingBlanket>;
    for (const p of s.pairs) {
      const w = waiting.items.find((x) => x.id === p.blanketId)!;
      expect(w.fits.find((f) => f.needId === p.needId)!.ok, `${p.blanketCode} → ${p.recipientName}`).toBe(true);
      expect(p.reasons.length).toBeGreaterThan(0);
    }
    expect(s.pairs.length + s.unplaced.length).toBe(waiting.total);
    expect(await Assignment.count()).toBe(before);
  });

  it('keeps to one recipient when asked, and says so for an unknown one (400)', async () => {
    const s = (await organiser.post('/api/matching/suggest', { recipientId: ward.id })).body as Suggestion;
    expect(s.pairs.every((p) => p.recipientId === ward.id)).toBe(true);
    expect((await organiser.post('/api/matching/suggest', { recipientId: 999999 })).status).toBe(400);
  });
});

type Res = { status: number; body: { error?: { message?: string } } };

function expectRace(results: Res[], winners: number, winStatus: number, loserText: RegExp) {
  const by = new Map<number, number>();
  for (const r of results) by.set(r.status, (by.get(r.status) ?? 0) + 1);
  expect([...by.keys()].filter((s) => s >= 500), `server errors in ${JSON.stringify([...by])}`).toEqual([]);
  expect(by.get(winStatus) ?? 0).toBe(winners);
  expect(by.get(409) ?? 0).toBe(results.length - winners);
  for (const r of results.filter((x) => x.status === 409)) expect(r.body.error?.message ?? '').toMatch(loserText);
}

describe('20 organisers at once', () => {
  it('assigning the same blanket: exactly one wins, the others hear it was just assigned and to whom', async () => {
    const needs = await Promise.all(Array.from({ length: 4 }, () => needFor(shelter, 10)));
    const b = await checkedBlanket();
    const staff = [organiser, coordinator];
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) => staff[i % 2]!.post('/api/assignments', { blanketId: b.id, needId: needs[i % 4]!.id })),
    );
    expectRace(results, 1, 201, /was just assigned to Test Family Rooms/);
    expect(await Assignment.count({ where: { blanketId: b.id, endedAt: null } })).toBe(1);
  });

  it('assigning 20 different blankets to a need of 3: exactly 3 win, the need is never over-filled', async () => {
    const need = await needFor(shelter, 3);
    const bs = await Promise.all(Array.from({ length: 20 }, () => checkedBlanket()));
    const staff = [organiser, coordinator];
    const results = await Promise.all(bs.map((b, i) => staff[i % 2]!.post('/api/assignments', { blanketId: b.id, needId: need.id })));
    expectRace(results, 3, 201, /is full: 3 of 3/);
    expect(await Assignment.count({ where: { needId: need.id, endedAt: null } })).toBe(3);
    expect(await Blanket.count({ where: { id: bs.map((b) => b.id), status: 'assigned' } })).toBe(3);
  });

  it('unassigning the same assignment: one wins, the rest are told it already ended', async () => {
    const need = await needFor(shelter, 3);
    const b = await checkedBlanket();
    const a = (await organiser.post('/api/assignments', { blanketId: b.id, needId: need.id })).body.assignment as AssignmentView;
    const results = await Promise.all(Array.from({ length: 20 }, () => organiser.delete(`/api/assignments/${a.id}`).send({ reason: 'Not needed' })));
    expectRace(results, 1, 200, /already ended|checked/);
  });
});
