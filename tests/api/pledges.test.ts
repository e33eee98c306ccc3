import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Pledge } from '../../server/db/models/pledge';
import { Need } from '../../server/db/models/need';
import { Recipient } from '../../server/db/models/recipient';
import { User } from '../../server/db/models/user';
import type { OpenNeed, PledgeView } from '@shared/schemas/pledge';

let t: TestApp;
let vol: Client;
let other: Client;
let organiser: Client;
let coordinator: Client;

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

async function needFor(kind: string, size: string): Promise<Need & { recipient: Recipient }> {
  const needs = (await Need.findAll({ include: [{ model: Recipient, as: 'recipient' }] })) as Array<Need & { recipient: Recipient }>;
  const n = needs.find((x) => x.recipient.kind === kind && x.sizeCategory === size);
  if (!n) throw new Error(`demo has no ${kind} ${size} need`);
  return n;
}

beforeAll(async () => {
  t = await makeTestApp();
  vol = await signedIn(t.app, 'volunteer');
  other = await signedIn(t.app, 'maren@example.org');
  organiser = await signedIn(t.app, 'organiser');
  coordinator = await signedIn(t.app, 'coordinator');
});
afterAll(async () => t.close());

describe('GET /api/needs', () => {
  it('needs a signed-in user', async () => {
    expect((await request(t.app).get('/api/needs')).status).toBe(401);
  });

  it('lists open needs with pledged and still-wanted counts that match the pledges on file', async () => {
    const res = await vol.get('/api/needs');
    expect(res.status).toBe(200);
    const needs = res.body.needs as OpenNeed[];
    expect(needs.length).toBeGreaterThan(0);
    for (const n of needs) {
      const pledges = await Pledge.findAll({ where: { needId: n.id } });
      const pledged = pledges.filter((p) => p.status !== 'cancelled').reduce((s, p) => s + p.quantity, 0);
      expect(n.pledged, `need ${n.id}`).toBe(pledged);
      expect(n.stillWanted).toBe(Math.max(0, n.quantity - pledged));
      expect(n.overPledged).toBe(Math.max(0, pledged - n.quantity));
      expect(n.deadline >= day(0)).toBe(true);
      expect(n.recipient.guidelineSummary.length).toBeGreaterThan(0);
    }
  });

  it('shows over-pledging (the demo hospice lap need is promised more than it asked for)', async () => {
    const n = await needFor('hospice', 'lap');
    const res = await coordinator.get('/api/needs');
    const view = (res.body.needs as OpenNeed[]).find((x) => x.id === n.id)!;
    expect(view.pledged).toBeGreaterThan(view.quantity);
    expect(view.overPledged).toBe(view.pledged - view.quantity);
    expect(view.stillWanted).toBe(0);
  });

  it('gives infant recipients the infant cautions and the facility-policy note', async () => {
    const n = await needFor('neonatal-unit', 'preemie');
    const view = ((await vol.get('/api/needs')).body.needs as OpenNeed[]).find((x) => x.id === n.id)!;
    const ids = view.recipient.cautions.map((c) => c.id);
    expect(ids).toContain('infant.small-parts');
    expect(ids).toContain('facility-policy');
    expect(view.recipient.guidelineSummary.join(' ')).toMatch(/No .*fringe/);
  });

  it('leaves out needs whose deadline has passed', async () => {
    const n = await needFor('care-home', 'lap');
    const deadline = n.deadline;
    await n.update({ deadline: day(-1) });
    try {
      const ids = ((await vol.get('/api/needs')).body.needs as OpenNeed[]).map((x) => x.id);
      expect(ids).not.toContain(n.id);
    } finally {
      await n.update({ deadline });
    }
  });
});

describe('the demo volunteer', () => {
  it('has two pledges, one of them late', async () => {
    const res = await vol.get('/api/pledges');
    expect(res.status).toBe(200);
    const pledges = res.body.items as PledgeView[];
    expect(pledges).toHaveLength(2);
    expect(pledges.filter((p) => p.late)).toHaveLength(1);
    expect(pledges.every((p) => p.need?.recipient.name)).toBe(true);
  });
});

describe('POST /api/pledges', () => {
  it('pledges against a need and counts towards it', async () => {
    const n = await needFor('family-shelter', 'crib');
    const before = ((await vol.get('/api/needs')).body.needs as OpenNeed[]).find((x) => x.id === n.id)!;
    const res = await vol.post('/api/pledges', { needId: n.id, quantity: 2, sizeCategory: 'crib', dueDate: n.deadline });
    expect(res.status).toBe(201);
    expect(res.body.pledge).toMatchObject({ needId: n.id, quantity: 2, status: 'active', late: false, blanketsLogged: 0 });
    expect(res.body.pledge.need.recipient.name).toBe(n.recipient.name);
    const after = ((await vol.get('/api/needs')).body.needs as OpenNeed[]).find((x) => x.id === n.id)!;
    expect(after.pledged).toBe(before.pledged + 2);
    expect(after.myPledged).toBe(before.myPledged + 2);
  });

  it('pledges "wherever it is needed most" with needId null', async () => {
    const res = await vol.post('/api/pledges', { needId: null, quantity: 1, sizeCategory: 'throw', dueDate: day(30) });
    expect(res.status).toBe(201);
    expect(res.body.pledge).toMatchObject({ needId: null, need: null, sizeCategory: 'throw' });
  });

  const bad: Array<[string, Record<string, unknown>, string]> = [
    ['a quantity of 0', { quantity: 0 }, 'quantity'],
    ['a quantity of 10,000', { quantity: 10_000 }, 'quantity'],
    ['a fractional quantity', { quantity: 1.5 }, 'quantity'],
    ['a quantity as text', { quantity: 'two' }, 'quantity'],
    ['an unknown size', { sizeCategory: 'king' }, 'sizeCategory'],
    ['a date that does not exist', { dueDate: '2027-02-30' }, 'dueDate'],
    ['a date in another format', { dueDate: '01/02/2027' }, 'dueDate'],
    ['a date in the past', { dueDate: day(-3) }, 'dueDate'],
    ['a date years ahead', { dueDate: day(900) }, 'dueDate'],
    ['a negative needId', { needId: -4 }, 'needId'],
  ];
  it.each(bad)('refuses %s with a 400 naming the field, and writes nothing', async (_label, change, field) => {
    const count = await Pledge.count();
    const res = await vol.post('/api/pledges', { needId: null, quantity: 2, sizeCategory: 'lap', dueDate: day(20), ...change });
    expect(res.status).toBe(400);
    expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain(field);
    expect(await Pledge.count()).toBe(count);
  });

  it('refuses a need that does not exist (404 naming needId)', async () => {
    const res = await vol.post('/api/pledges', { needId: 99999, quantity: 1, sizeCategory: 'lap', dueDate: day(10) });
    expect(res.status).toBe(404);
    expect(res.body.error.issues[0].path).toBe('needId');
  });

  it('refuses a size the need does not ask for', async () => {
    const n = await needFor('neonatal-unit', 'preemie');
    const res = await vol.post('/api/pledges', { needId: n.id, quantity: 1, sizeCategory: 'throw', dueDate: day(5) });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('sizeCategory');
    expect(res.body.error.message).toMatch(/preemie/);
  });

  it('refuses a finish date after the need closes', async () => {
    const n = await needFor('neonatal-unit', 'preemie');
    const res = await vol.post('/api/pledges', { needId: n.id, quantity: 1, sizeCategory: 'preemie', dueDate: day(200) });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('dueDate');
    expect(res.body.error.message).toContain(n.deadline);
  });

  it('refuses a need whose recipient has stopped collecting (409)', async () => {
    const n = await needFor('hospice', 'throw');
    await n.recipient.update({ active: false });
    try {
      const res = await vol.post('/api/pledges', { needId: n.id, quantity: 1, sizeCategory: 'throw', dueDate: day(5) });
      expect(res.status).toBe(409);
      expect(res.body.error.issues[0].path).toBe('needId');
    } finally {
      await n.recipient.update({ active: true });
    }
  });

  it('refuses fields it does not know, so nobody can pledge in another person\'s name', async () => {
    const count = await Pledge.count();
    const created = await vol.post('/api/pledges', { needId: null, quantity: 1, sizeCategory: 'lap', dueDate: day(9), userId: 2 });
    expect(created.status).toBe(400);
    expect(created.body.error.message).toMatch(/userId/);
    expect(await Pledge.count()).toBe(count);
    const mine = (await vol.get('/api/pledges')).body.items as PledgeView[];
    const res = await vol.patch(`/api/pledges/${mine[0]!.id}`, { quantity: 2, userId: 1 });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/userId/);
  });
});

describe('pledge ownership', () => {
  let marenPledge: PledgeView;
  beforeAll(async () => {
    marenPledge = ((await other.get('/api/pledges')).body.items as PledgeView[])[0]!;
  });

  it("answers 404 to a volunteer for someone else's pledge, whatever the verb", async () => {
    expect((await vol.get(`/api/pledges/${marenPledge.id}`)).status).toBe(404);
    expect((await vol.patch(`/api/pledges/${marenPledge.id}`, { quantity: 1 })).status).toBe(404);
    expect((await vol.delete(`/api/pledges/${marenPledge.id}`)).status).toBe(404);
    const still = await Pledge.findByPk(marenPledge.id);
    expect(still!.quantity).toBe(marenPledge.quantity);
    expect(still!.status).toBe(marenPledge.status);
  });

  it("lists only a volunteer's own pledges", async () => {
    const me = await User.findOne({ where: { email: 'volunteer@example.org' } });
    const res = await vol.get('/api/pledges');
    expect((res.body.items as PledgeView[]).every((p) => p.userId === me!.id)).toBe(true);
  });

  it("lets organisers and coordinators read everyone's pledges, and ask for only their own", async () => {
    const all = await organiser.get('/api/pledges?pageSize=100');
    expect(all.status).toBe(200);
    expect(all.body.total).toBe(await Pledge.count());
    expect((all.body.items as PledgeView[]).length).toBe(Math.min(100, all.body.total));
    expect((all.body.items as PledgeView[]).find((p) => p.id === marenPledge.id)?.makerName).toBe('Maren Oakley');
    expect((await coordinator.get(`/api/pledges/${marenPledge.id}`)).status).toBe(200);
    expect((await organiser.get('/api/pledges?mine=true')).body.items).toEqual([]);
  });

  it("does not let an organiser change someone else's pledge (403)", async () => {
    const res = await organiser.patch(`/api/pledges/${marenPledge.id}`, { quantity: 1 });
    expect(res.status).toBe(403);
    expect((await Pledge.findByPk(marenPledge.id))!.quantity).toBe(marenPledge.quantity);
  });
});

describe('PATCH and DELETE /api/pledges/:id', () => {
  it('pushes a late pledge back so it is no longer late', async () => {
    const late = ((await vol.get('/api/pledges')).body.items as PledgeView[]).find((p) => p.late)!;
    const res = await vol.patch(`/api/pledges/${late.id}`, { dueDate: day(14), version: late.version });
    expect(res.status).toBe(200);
    expect(res.body.pledge).toMatchObject({ id: late.id, late: false, dueDate: day(14) });
    expect(res.body.pledge.version).toBe(late.version + 1);
  });

  it('flags a push-back past the need deadline instead of refusing it', async () => {
    const mine = ((await vol.get('/api/pledges')).body.items as PledgeView[]).find((p) => p.need)!;
    const after = new Date(Date.parse(`${mine.need!.deadline}T00:00:00Z`) + 5 * 86_400_000).toISOString().slice(0, 10);
    const res = await vol.patch(`/api/pledges/${mine.id}`, { dueDate: after });
    expect(res.status).toBe(200);
    expect(res.body.pledge.afterDeadline).toBe(true);
  });

  it('refuses a stale version with 409', async () => {
    const p = ((await vol.get('/api/pledges')).body.items as PledgeView[])[0]!;
    const res = await vol.patch(`/api/pledges/${p.id}`, { quantity: p.quantity, version: p.version - 1 });
    expect(res.status).toBe(409);
    expect(res.body.error.issues[0].path).toBe('version');
  });

  it('refuses to reduce a pledge below the blankets already logged under it', async () => {
    const p = ((await vol.get('/api/pledges')).body.items as PledgeView[]).find((x) => x.blanketsLogged === 2)!;
    const res = await vol.patch(`/api/pledges/${p.id}`, { quantity: 1 });
    expect(res.status).toBe(409);
    expect(res.body.error.issues[0].path).toBe('quantity');
    expect((await Pledge.findByPk(p.id))!.quantity).toBe(p.quantity);
  });

  it('refuses to cancel a pledge that has blankets, and says to reduce it instead', async () => {
    const p = ((await vol.get('/api/pledges')).body.items as PledgeView[]).find((x) => x.blanketsLogged > 0)!;
    const res = await vol.delete(`/api/pledges/${p.id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/reduce it/);
    expect((await Pledge.findByPk(p.id))!.status).not.toBe('cancelled');
  });

  it('reduces, then cancels a pledge with no blankets; a cancelled pledge cannot be edited', async () => {
    const created = await vol.post('/api/pledges', { needId: null, quantity: 4, sizeCategory: 'baby', dueDate: day(25) });
    const id = created.body.pledge.id;
    const reduced = await vol.patch(`/api/pledges/${id}`, { quantity: 2 });
    expect(reduced.body.pledge.quantity).toBe(2);
    const cancelled = await vol.delete(`/api/pledges/${id}`);
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.pledge.status).toBe('cancelled');
    expect((await vol.patch(`/api/pledges/${id}`, { quantity: 3 })).status).toBe(409);
    // Cancelled pledges no longer count towards a need.
    expect(((await vol.get('/api/pledges?status=cancelled')).body.items as PledgeView[]).map((p) => p.id)).toContain(id);
  });

  it('moves a pledge with no blankets to another need, checking the size against it', async () => {
    const n = await needFor('care-home', 'lap');
    const created = await vol.post('/api/pledges', { needId: null, quantity: 1, sizeCategory: 'lap', dueDate: day(10) });
    const id = created.body.pledge.id;
    const moved = await vol.patch(`/api/pledges/${id}`, { needId: n.id });
    expect(moved.status).toBe(200);
    expect(moved.body.pledge.need.id).toBe(n.id);
    const wrong = await vol.patch(`/api/pledges/${id}`, { sizeCategory: 'twin' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.issues[0].path).toBe('sizeCategory');
  });

  it('refuses an empty change', async () => {
    const p = ((await vol.get('/api/pledges')).body.items as PledgeView[])[0]!;
    expect((await vol.patch(`/api/pledges/${p.id}`, {})).status).toBe(400);
  });
});
