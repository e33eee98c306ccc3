import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Assignment } from '../../server/db/models/assignment';
import { Blanket } from '../../server/db/models/blanket';
import { BlanketEvent } from '../../server/db/models/blanket-event';
import { Export, Run } from '../../server/db/models/run';
import { Need } from '../../server/db/models/need';
import { Pledge } from '../../server/db/models/pledge';
import { DateTime } from 'luxon';
import { driveToday, driveZone } from '../../server/modules/bookings/drive-clock';
import { plainBlanket } from '../fixtures/blankets';
import type { InferCreationAttributes } from 'sequelize';
import { User } from '../../server/db/models/user';
import { Recipient } from '../../server/db/models/recipient';
import { GLANCE_STEPS, STEP_STATUSES, arrivalMoves, stepOf, weekAfter, weekOf, type GlanceStep } from '@shared/drive/glance';
import type { BlanketStatus } from '@shared/schemas/blanket';
import type { DriveGlance } from '@shared/schemas/glance';

/**
 * The figures of the drive at a glance are counted by SQL on the server. Here they are counted again
 * the slow way, row by row in JavaScript, on the demo drive, and the two must agree; and each list a
 * figure links to must hold as many blankets as the figure says.
 */
let t: TestApp;
let coordinator: Client;
let glance: DriveGlance;
let zone: string;

beforeAll(async () => {
  t = await makeTestApp();
  coordinator = await signedIn(t.app, 'coordinator');
  const res = await coordinator.get('/api/drive/glance');
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  glance = res.body.glance as DriveGlance;
  zone = await driveZone();
});
afterAll(async () => t.close());

/** The drive's local day of an instant (decision 0015), counted here with luxon as a second opinion. */
const day = (d: Date) => DateTime.fromJSDate(d, { zone }).toISODate()!;

async function recount() {
  const blankets = await Blanket.findAll({ attributes: ['id', 'status', 'pledgeId', 'createdAt'], raw: true });
  const live = await Assignment.findAll({ where: { endedAt: null }, attributes: ['blanketId', 'needId'], raw: true });
  const pledges = await Pledge.findAll({ attributes: ['id', 'needId', 'quantity', 'status', 'createdAt'], raw: true });
  const events = await BlanketEvent.findAll({ attributes: ['blanketId', 'fromStatus', 'toStatus', 'createdAt'], raw: true });
  const liveNeed = new Map(live.map((a) => [a.blanketId, a.needId]));
  const pledgeNeed = new Map(pledges.map((p) => [p.id, p.needId]));
  const needOf = (b: { id: number; pledgeId: number | null }) => liveNeed.get(b.id) ?? (b.pledgeId ? pledgeNeed.get(b.pledgeId) ?? null : null);
  return { blankets, pledges, events, needOf };
}

describe('the drive at a glance agrees with a recount of the demo drive', () => {
  it('blankets now at each step, in all and per open need', async () => {
    const { blankets, needOf } = await recount();
    for (const step of GLANCE_STEPS) {
      const mine = blankets.filter((b) => stepOf(b.status as BlanketStatus) === step);
      expect(glance.totals[step], step).toBe(mine.length);
    }
    expect(glance.totals.inProgress).toBe(blankets.filter((b) => b.status === 'in_progress').length);
    expect(glance.totals.declined).toBe(blankets.filter((b) => b.status === 'declined').length);
    // The demo has something at most steps, or this would prove little.
    expect(GLANCE_STEPS.filter((s) => glance.totals[s] > 0).length).toBeGreaterThanOrEqual(5);

    const today = await driveToday();
    const open = await Need.findAll({ where: {}, include: [{ model: Recipient, as: 'recipient' }] });
    const openIds = open.filter((n) => n.deadline >= today && n.recipient!.active).map((n) => n.id).sort((a, b) => a - b);
    expect(glance.needs.map((n) => n.needId).sort((a, b) => a - b)).toEqual(openIds);
    for (const n of glance.needs) {
      for (const step of GLANCE_STEPS) {
        const mine = blankets.filter((b) => needOf(b) === n.needId && stepOf(b.status as BlanketStatus) === step);
        expect(n.now[step], `need ${n.needId} ${step}`).toBe(mine.length);
      }
    }
  });

  it('wanted and pledged per need, and the needs at risk by the stated rule', async () => {
    const { pledges } = await recount();
    const today = await driveToday();
    for (const n of glance.needs) {
      const need = (await Need.findByPk(n.needId))!;
      expect(n.wanted).toBe(need.quantity);
      expect(n.pledged).toBe(pledges.filter((p) => p.needId === n.needId && ['active', 'fulfilled'].includes(p.status)).reduce((s, p) => s + p.quantity, 0));
      const days = Math.round((Date.parse(need.deadline) - Date.parse(today)) / 86_400_000);
      expect(n.daysLeft).toBe(days);
      // The rule the page states: 21 days or less, and too few pledged or assigned (packed and delivered count as assigned).
      const short = n.pledged < n.wanted || n.assignedSoFar < n.wanted;
      expect(n.atRisk, `need ${n.needId}`).toBe(days >= 0 && days <= 21 && short);
    }
    expect(glance.needs.some((n) => n.atRisk)).toBe(true);
    expect(glance.needs.some((n) => !n.atRisk)).toBe(true);
  });

  it('per week: blankets pledged, and distinct blankets that reached each step, from the history', async () => {
    const { pledges, events } = await recount();
    expect(glance.weeks.length).toBeGreaterThan(2);
    for (let i = 1; i < glance.weeks.length; i++) expect(glance.weeks[i]!.week).toBe(weekAfter(glance.weeks[i - 1]!.week));
    expect(glance.weeks.at(-1)!.week).toBe(weekOf(await driveToday()));
    const reachedBy = new Map<string, Set<number>>();
    for (const e of events) {
      if (!e.toStatus) continue;
      for (const step of GLANCE_STEPS) {
        if (!arrivalMoves(step).some((m) => m.from === e.fromStatus && m.to === e.toStatus)) continue;
        const key = `${weekOf(day(new Date(e.createdAt)))} ${step}`;
        reachedBy.set(key, (reachedBy.get(key) ?? new Set()).add(e.blanketId));
      }
    }
    let any = 0;
    for (const w of glance.weeks) {
      for (const step of GLANCE_STEPS) {
        expect(w.reached[step], `${w.week} ${step}`).toBe(reachedBy.get(`${w.week} ${step}`)?.size ?? 0);
        any += w.reached[step];
      }
      const p = pledges.filter((x) => ['active', 'fulfilled'].includes(x.status) && weekOf(day(new Date(x.createdAt))) === w.week);
      expect(w.pledged, w.week).toBe(p.reduce((s, x) => s + x.quantity, 0));
    }
    expect(any).toBeGreaterThan(10);
  });

  it('the demo drive was promised over weeks, each pledge before its first blanket was logged', async () => {
    const { pledges } = await recount();
    const firstLogged = new Map<number, number>();
    const logged = await BlanketEvent.findAll({ where: { kind: 'logged' }, attributes: ['blanketId', 'createdAt'], raw: true });
    const pledgeOf = new Map((await Blanket.findAll({ attributes: ['id', 'pledgeId'], raw: true })).map((b) => [b.id, b.pledgeId]));
    for (const e of logged) {
      const p = pledgeOf.get(e.blanketId);
      if (p == null) continue;
      const t = new Date(e.createdAt).getTime();
      firstLogged.set(p, Math.min(firstLogged.get(p) ?? Infinity, t));
    }
    expect(firstLogged.size).toBeGreaterThan(10);
    for (const p of pledges) {
      const first = firstLogged.get(p.id);
      if (first !== undefined) expect(new Date(p.createdAt).getTime(), `pledge ${p.id}`).toBeLessThan(first);
    }
    // More than one week holds new pledges, so the week-by-week chart does not start the drive today.
    expect(glance.weeks.filter((w) => w.pledged > 0).length).toBeGreaterThan(2);
  });

  it('week by week for one need: its pledges, and the blankets that count for it', async () => {
    const { blankets, pledges, events, needOf } = await recount();
    const need = [...glance.needs].sort((a, b) => GLANCE_STEPS.reduce((s, x) => s + b.now[x] - a.now[x], 0))[0]!;
    const res = await coordinator.get(`/api/drive/glance/weeks?needId=${need.needId}`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const weeks = res.body.weeks as DriveGlance['weeks'];
    const mine = new Set(blankets.filter((b) => needOf(b) === need.needId).map((b) => b.id));
    expect(mine.size).toBeGreaterThan(3);
    let any = 0;
    for (const w of weeks) {
      for (const step of GLANCE_STEPS) {
        const ids = new Set(
          events
            .filter((e) => mine.has(e.blanketId) && weekOf(day(new Date(e.createdAt))) === w.week)
            .filter((e) => arrivalMoves(step).some((m) => m.from === e.fromStatus && m.to === e.toStatus))
            .map((e) => e.blanketId),
        );
        expect(w.reached[step], `${w.week} ${step}`).toBe(ids.size);
        any += ids.size;
        if (ids.size > 0) {
          const list = await coordinator.get(`/api/blankets?reached=${step}&from=${w.week}&to=${weekAfter(w.week)}&needId=${need.needId}`);
          expect(list.body.total, `list for ${w.week} ${step}`).toBe(ids.size);
        }
      }
      const p = pledges.filter((x) => x.needId === need.needId && ['active', 'fulfilled'].includes(x.status) && weekOf(day(new Date(x.createdAt))) === w.week);
      expect(w.pledged, w.week).toBe(p.reduce((s, x) => s + x.quantity, 0));
    }
    expect(any).toBeGreaterThan(3);
    expect((await coordinator.get('/api/drive/glance/weeks')).status).toBe(400);
    expect((await coordinator.get('/api/drive/glance/weeks?needId=-2')).body.error.issues[0].path).toBe('needId');
  });

  it('the blankets waiting longest at each step, since the entry that brought them there', async () => {
    const { blankets, events } = await recount();
    for (const w of glance.waiting) {
      const here = blankets
        .filter((b) => stepOf(b.status as BlanketStatus) === w.step)
        .map((b) => {
          const brought = events.filter((e) => e.blanketId === b.id && e.toStatus === b.status).map((e) => new Date(e.createdAt).getTime());
          return { id: b.id, since: brought.length ? Math.max(...brought) : new Date(b.createdAt).getTime() };
        })
        .sort((a, b) => a.since - b.since || a.id - b.id);
      expect(w.count, w.step).toBe(here.length);
      expect(w.longest.map((x) => x.id), w.step).toEqual(here.slice(0, 3).map((x) => x.id));
      for (const [i, x] of w.longest.entries()) expect(new Date(x.since).getTime()).toBe(here[i]!.since);
    }
    expect(glance.waiting.map((w) => w.step)).toEqual(['finished', 'received', 'checked', 'assigned', 'packed']);
  });

  it('upcoming runs and recent exports', async () => {
    const today = await driveToday();
    const upcoming = (await Run.findAll()).filter((r) => r.runDate >= today);
    expect(glance.upcomingRuns.total).toBe(upcoming.length);
    expect(glance.upcomingRuns.items.length).toBe(Math.min(5, upcoming.length));
    expect(glance.upcomingRuns.total).toBeGreaterThan(0);
    expect(glance.recentExports.total).toBe(await Export.count());
    const times = glance.recentExports.items.map((e) => e.createdAt);
    expect([...times].sort().reverse()).toEqual(times);
  });
});

describe('each figure links to a list that holds as many blankets', () => {
  const total = async (query: string) => {
    const res = await coordinator.get(`/api/blankets?${query}`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    return res.body.total as number;
  };

  it('a step in all, and a step of one need', async () => {
    for (const step of GLANCE_STEPS) expect(await total(`step=${step}`), step).toBe(glance.totals[step]);
    let checked = 0;
    for (const n of glance.needs) {
      for (const step of GLANCE_STEPS) {
        if (n.now[step] === 0 && checked > 3) continue;
        expect(await total(`step=${step}&needId=${n.needId}`), `need ${n.needId} ${step}`).toBe(n.now[step]);
        checked++;
      }
    }
  });

  it('the blankets that reached a step in a week', async () => {
    let checked = 0;
    for (const w of glance.weeks) {
      for (const step of GLANCE_STEPS as readonly GlanceStep[]) {
        if (w.reached[step] === 0) continue;
        expect(await total(`reached=${step}&from=${w.week}&to=${weekAfter(w.week)}`), `${w.week} ${step}`).toBe(w.reached[step]);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(5);
  });

  it('pledged per need and per week: the pledges still standing add up to the figure', async () => {
    const pledged = async (query: string) => {
      const res = await coordinator.get(`/api/pledges?promising=true&${query}`);
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      return res.body.blankets as number;
    };
    for (const n of glance.needs) expect(await pledged(`needId=${n.needId}`), `need ${n.needId}`).toBe(n.pledged);
    const weeks = glance.weeks.filter((w) => w.pledged > 0);
    expect(weeks.length).toBeGreaterThan(0);
    for (const w of weeks) expect(await pledged(`from=${w.week}&to=${weekAfter(w.week)}`), w.week).toBe(w.pledged);
    expect((await coordinator.get('/api/pledges?from=2026-11-02')).status).toBe(400);
  });

  it('refuses half a filter with the field named (400), never a server error', async () => {
    const half = await coordinator.get('/api/blankets?reached=received&from=2026-11-02');
    expect(half.status).toBe(400);
    expect(half.body.error.issues[0].path).toBe('reached');
    const badStep = await coordinator.get('/api/blankets?step=knitted');
    expect(badStep.status).toBe(400);
    expect(badStep.body.error.issues[0].path).toBe('step');
    const backwards = await coordinator.get('/api/blankets?reached=received&from=2026-11-09&to=2026-11-02');
    expect(backwards.status).toBe(400);
    expect((await coordinator.get('/api/blankets?needId=abc')).status).toBe(400);
  });

  it('is for staff: a maker is refused', async () => {
    const volunteer = await signedIn(t.app, 'volunteer');
    expect((await volunteer.get('/api/drive/glance')).status).toBe(403);
  });
});

// STEP_STATUSES is what the lists filter by; every status but in progress and declined belongs to one step.
it('every status on the way to delivery belongs to exactly one step', () => {
  const all = GLANCE_STEPS.flatMap((s) => STEP_STATUSES[s]);
  expect(new Set(all).size).toBe(all.length);
  expect(stepOf('in_progress')).toBeNull();
  expect(stepOf('declined')).toBeNull();
});

// Before the empty drive below: opening it rebinds the models to its own database.
describe('weeks begin on the Monday of the drive\'s own zone', () => {
  it('counts an arrival late on a UTC Sunday in the week that began that Monday in Auckland, list and figure alike', async () => {
    const before = await driveZone();
    const setZone = async (timeZone: string) => expect((await coordinator.put('/api/drive/clock', { timeZone })).status).toBe(200);
    await setZone('Pacific/Auckland');
    try {
      // The Sunday before this Auckland week began, 12:00 UTC: Monday 00:00 or 01:00 in Auckland
      // (UTC+12, or +13 in its summer), so a week earlier in UTC than in the drive's zone.
      const monday = weekOf(await driveToday());
      const atMs = Date.parse(`${monday}T12:00:00Z`) - 86_400_000;
      expect(DateTime.fromMillis(atMs, { zone: 'Pacific/Auckland' }).toISODate()).toBe(monday);
      const maker = (await User.findOne({ where: { email: 'maren@example.org' } }))!;
      const blanket = await Blanket.create({ code: 'KL-ZONE', userId: maker.id, status: 'checked', ...plainBlanket() } as unknown as InferCreationAttributes<Blanket>);
      await BlanketEvent.create({ blanketId: blanket.id, actorId: maker.id, kind: 'inspection', fromStatus: 'received', toStatus: 'checked', createdAt: new Date(atMs) });
      const weeks = ((await coordinator.get('/api/drive/glance')).body.glance as DriveGlance).weeks;
      const week = (w: string) => weeks.find((x) => x.week === w)?.reached.checked ?? 0;
      const utcWeekBefore = new Date(Date.parse(`${monday}T00:00:00Z`) - 7 * 86_400_000).toISOString().slice(0, 10);
      const { events } = await recount();
      const checkedIn = (w: string) =>
        new Set(
          events
            .filter((e) => e.toStatus === 'checked' && e.fromStatus === 'received' && weekOf(DateTime.fromJSDate(new Date(e.createdAt), { zone: 'Pacific/Auckland' }).toISODate()!) === w)
            .map((e) => e.blanketId),
        );
      expect(checkedIn(monday).has(blanket.id)).toBe(true);
      expect(week(monday)).toBe(checkedIn(monday).size);
      expect(week(utcWeekBefore)).toBe(checkedIn(utcWeekBefore).size);
      const list = await coordinator.get(`/api/blankets?reached=checked&from=${monday}&to=${weekAfter(monday)}&pageSize=100`);
      expect(list.status, JSON.stringify(list.body)).toBe(200);
      expect(list.body.total).toBe(week(monday));
      expect((list.body.items as Array<{ code: string }>).map((b) => b.code)).toContain('KL-ZONE');
      const earlier = await coordinator.get(`/api/blankets?reached=checked&from=${utcWeekBefore}&to=${monday}&pageSize=100`);
      expect((earlier.body.items as Array<{ code: string }>).map((b) => b.code)).not.toContain('KL-ZONE');
    } finally {
      await setZone(before);
    }
  });
});

describe('a drive with nothing in it yet', () => {
  it('counts zeros, no weeks and nothing waiting, without an error', async () => {
    const empty = await makeTestApp({ seed: false });
    try {
      const { driveGlance } = await import('../../server/modules/drive/glance.service');
      const g = await driveGlance();
      expect(g.needs).toEqual([]);
      expect(g.weeks).toEqual([]);
      for (const s of GLANCE_STEPS) expect(g.totals[s]).toBe(0);
      expect(g.waiting.every((w) => w.count === 0 && w.longest.length === 0)).toBe(true);
      expect(g.upcomingRuns.total).toBe(0);
      expect(g.recentExports.total).toBe(0);
    } finally {
      await empty.close();
    }
  });
});
