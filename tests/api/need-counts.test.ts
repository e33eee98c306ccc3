import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Need } from '../../server/db/models/need';
import { Pledge } from '../../server/db/models/pledge';
import { Blanket } from '../../server/db/models/blanket';
import { Assignment } from '../../server/db/models/assignment';
import { Recipient } from '../../server/db/models/recipient';
import { needCounts } from '../../server/modules/pledges/need-counts';
import type { DriveProgress, OpenNeed } from '@shared/schemas/pledge';
import type { RecipientView } from '@shared/schemas/recipient';

let t: TestApp;
let vol: Client;
let organiser: Client;

beforeAll(async () => {
  t = await makeTestApp();
  vol = await signedIn(t.app, 'volunteer');
  organiser = await signedIn(t.app, 'organiser');
});
afterAll(async () => t.close());

/**
 * The counts worked out the long way, row by row, as the rules say them: pledged = quantities of
 * active and fulfilled pledges; finished = their blankets past the hook and not declined; in hand =
 * received, checked or held for a fix; assigned = the need's live assignments (the blanket assigned,
 * packed or delivered), whatever the blanket was pledged for, plus its pledges' given-out blankets
 * that have no assignment on record.
 */
async function countsTheLongWay(needId: number) {
  const need = (await Need.findByPk(needId))!;
  const pledges = await Pledge.findAll({ where: { needId } });
  const promising = pledges.filter((p) => p.status === 'active' || p.status === 'fulfilled');
  const blankets = promising.length ? await Blanket.findAll({ where: { pledgeId: promising.map((p) => p.id) } }) : [];
  const has = (...s: string[]) => blankets.filter((b) => s.includes(b.status)).length;
  return {
    needId,
    recipientId: need.recipientId,
    wanted: need.quantity,
    pledged: promising.reduce((n, p) => n + p.quantity, 0),
    finished: blankets.filter((b) => b.status !== 'in_progress' && b.status !== 'declined').length,
    inHand: has('received', 'checked', 'needs_fix'),
    assigned:
      (await Assignment.findAll({ where: { needId, endedAt: null }, include: [{ model: Blanket, as: 'blanket' }] })).filter((a) =>
        ['assigned', 'packed', 'delivered'].includes((a as Assignment & { blanket: Blanket }).blanket.status),
      ).length +
      (
        await Promise.all(
          blankets
            .filter((b) => ['assigned', 'packed', 'delivered'].includes(b.status))
            .map(async (b) => (await Assignment.count({ where: { blanketId: b.id, endedAt: null } })) === 0),
        )
      ).filter(Boolean).length,
  };
}

describe('one count per need, the same on every page', () => {
  it('counts each need as the rules say, row by row', async () => {
    const needs = await Need.findAll();
    const counts = await needCounts(needs.map((n) => n.id));
    for (const n of needs) expect(counts.get(n.id), `need ${n.id}`).toEqual(await countsTheLongWay(n.id));
  });

  it("shows the same pledged figures on What's needed, the recipient pages and the progress chart", async () => {
    const open = (await vol.get('/api/needs')).body.needs as OpenNeed[];
    const recipients = (await organiser.get('/api/recipients?active=all')).body.recipients as RecipientView[];
    const progress = (await organiser.get('/api/drive/progress')).body.progress as DriveProgress;
    expect(open.length).toBeGreaterThan(0);
    for (const n of open) {
      const list = recipients.find((r) => r.id === n.recipient.id)!.needs.find((x) => x.id === n.id)!;
      const detail = ((await organiser.get(`/api/recipients/${n.recipient.id}`)).body.recipient as RecipientView).needs.find((x) => x.id === n.id)!;
      const long = await countsTheLongWay(n.id);
      expect(n.pledged, `needs page, need ${n.id}`).toBe(long.pledged);
      expect(list.pledged, `recipients list, need ${n.id}`).toBe(long.pledged);
      expect(detail.pledged, `recipient page, need ${n.id}`).toBe(long.pledged);
      expect({ finished: detail.finished, inHand: detail.inHand, assigned: detail.assigned }).toEqual({ finished: long.finished, inHand: long.inHand, assigned: long.assigned });
    }
    // The chart's row for a recipient is its open needs added up: the same figures again.
    for (const row of progress.recipients) {
      const mine = open.filter((n) => n.recipient.id === row.recipientId);
      expect(row.wanted, row.name).toBe(mine.reduce((s, n) => s + n.quantity, 0));
      expect(row.pledged, row.name).toBe(mine.reduce((s, n) => s + n.pledged, 0));
      const long = await Promise.all(mine.map((n) => countsTheLongWay(n.id)));
      expect(row.inHand, row.name).toBe(long.reduce((s, c) => s + c.inHand, 0));
      expect(row.assigned, row.name).toBe(long.reduce((s, c) => s + c.assigned, 0));
      expect(row.finished, row.name).toBe(long.reduce((s, c) => s + c.finished, 0));
    }
    expect(new Set(progress.recipients.map((r) => r.recipientId))).toEqual(new Set(open.map((n) => n.recipient.id)));
  });

  it('shows a volunteer the same pledged figures on the recipient pages as on What\'s needed', async () => {
    const open = (await vol.get('/api/needs')).body.needs as OpenNeed[];
    const list = (await vol.get('/api/recipients')).body.recipients as RecipientView[];
    for (const n of open) {
      const page = ((await vol.get(`/api/recipients/${n.recipient.id}`)).body.recipient as RecipientView).needs.find((x) => x.id === n.id)!;
      const row = list.find((r) => r.id === n.recipient.id)!.needs.find((x) => x.id === n.id)!;
      expect(page.pledged, `recipient page, need ${n.id}`).toBe(n.pledged);
      expect(row.pledged, `recipients list, need ${n.id}`).toBe(n.pledged);
    }
  });

  it("counts the chart's blankets per status as the staff blanket list does", async () => {
    const progress = (await organiser.get('/api/drive/progress')).body.progress as DriveProgress;
    expect(progress.statuses.length).toBeGreaterThan(3);
    for (const { status, count } of progress.statuses) {
      const page = await organiser.get(`/api/blankets?status=${status}&pageSize=1`);
      expect(page.status).toBe(200);
      expect(page.body.total, status).toBe(count);
    }
    const all = await organiser.get('/api/blankets?pageSize=1');
    expect(progress.statuses.reduce((n, s) => n + s.count, 0)).toBe(all.body.total);
  });

  it("moves the chart's blankets per status as soon as a blanket is logged, though the figure is kept between writes", async () => {
    const before = ((await organiser.get('/api/drive/progress')).body.progress as DriveProgress).statuses;
    // Asked again with nothing written: the same answer.
    expect(((await organiser.get('/api/drive/progress')).body.progress as DriveProgress).statuses).toEqual(before);
    const needs = (await Need.findAll({ include: [{ model: Recipient, as: 'recipient' }] })) as Array<Need & { recipient: Recipient }>;
    const n = needs.find((x) => x.recipient.kind === 'neonatal-unit' && x.sizeCategory === 'preemie')!;
    const p = await vol.post('/api/pledges', { needId: n.id, quantity: 1, sizeCategory: 'preemie', dueDate: n.deadline });
    expect(p.status).toBe(201);
    const b = await vol.post('/api/blankets', {
      pledgeId: p.body.pledge.id, widthCm: 45, lengthCm: 48, yarnWeight: 3, fibres: ['acrylic'], machineWashable: true, dryerSafe: true, smokeFree: true, petFree: true,
    });
    expect(b.status).toBe(201);
    const status = b.body.blanket.status as string;
    const after = ((await organiser.get('/api/drive/progress')).body.progress as DriveProgress).statuses;
    const count = (xs: typeof before) => xs.find((x) => x.status === status)?.count ?? 0;
    expect(count(after)).toBe(count(before) + 1);
  });

  it("counts the children's ward's completed pledge on its recipient page as on What's needed", async () => {
    const ward = (await Recipient.findOne({ where: { kind: 'childrens-ward' } }))!;
    const need = (await Need.findOne({ where: { recipientId: ward.id, sizeCategory: 'child' } }))!;
    expect(await Pledge.count({ where: { needId: need.id, status: 'fulfilled' } })).toBeGreaterThan(0);
    const onNeeds = ((await vol.get('/api/needs')).body.needs as OpenNeed[]).find((n) => n.id === need.id)!;
    const onPage = ((await organiser.get(`/api/recipients/${ward.id}`)).body.recipient as RecipientView).needs.find((n) => n.id === need.id)!;
    expect(onNeeds.pledged).toBeGreaterThanOrEqual(3);
    expect(onPage.pledged).toBe(onNeeds.pledged);
    expect(onPage.assigned).toBe(3);
  });

  it('does not count a declined blanket as finished for its pledge', async () => {
    const declined = (await Blanket.findOne({ where: { status: 'declined' } }))!;
    const pledge = (await Pledge.findByPk(declined.pledgeId!))!;
    const c = (await needCounts([pledge.needId!])).get(pledge.needId!)!;
    const others = await Blanket.count({ where: { pledgeId: pledge.id } });
    expect(others).toBeGreaterThan(0);
    expect(c.finished).toBe((await countsTheLongWay(pledge.needId!)).finished);
    const view = (await organiser.get(`/api/pledges/${pledge.id}`)).body.pledge;
    expect(view.blanketsFinished).toBe(0);
  });

  it('moves the figures as soon as a pledge is made, on every page', async () => {
    const open = (await vol.get('/api/needs')).body.needs as OpenNeed[];
    const n = open.find((x) => x.deadline > new Date(Date.now() + 3 * 86_400_000).toISOString().slice(0, 10))!;
    const before = n.pledged;
    const due = new Date(Date.now() + 2 * 86_400_000).toISOString().slice(0, 10);
    const made = await vol.post('/api/pledges', { needId: n.id, sizeCategory: n.sizeCategory, quantity: 2, dueDate: due });
    expect(made.status).toBe(201);
    const after = ((await vol.get('/api/needs')).body.needs as OpenNeed[]).find((x) => x.id === n.id)!;
    expect(after.pledged).toBe(before + 2);
    const page = ((await organiser.get(`/api/recipients/${n.recipient.id}`)).body.recipient as RecipientView).needs.find((x) => x.id === n.id)!;
    expect(page.pledged).toBe(before + 2);
    const cancelled = await vol.delete(`/api/pledges/${made.body.pledge.id}`);
    expect(cancelled.status).toBe(200);
    expect(((await vol.get('/api/needs')).body.needs as OpenNeed[]).find((x) => x.id === n.id)!.pledged).toBe(before);
  });
});
