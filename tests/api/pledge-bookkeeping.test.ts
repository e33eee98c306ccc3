import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Blanket } from '../../server/db/models/blanket';
import { Need } from '../../server/db/models/need';
import { Pledge } from '../../server/db/models/pledge';
import { Recipient } from '../../server/db/models/recipient';
import { Site } from '../../server/db/models/site';
import { User } from '../../server/db/models/user';
import { moveBlanket } from '../../server/modules/blankets/move-blanket';
import { needCounts } from '../../server/modules/pledges/need-counts';
import { pledgeView } from '../../server/modules/pledges/pledges.service';
import { ASSIGNED_STATUSES, FINISHED_STATUSES, WITH_ORGANISERS, STATUS_MOVES, moveChannel } from '@shared/blankets/status';
import type { BlanketStatus } from '@shared/schemas/blanket';
import type { Actor } from '../../server/auth/actor';
import { allGoodChecklist } from '../fixtures/blankets';

let t: TestApp;
let vol: Client;
let organiser: Client;
let hall: Site;

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

async function preemieNeed() {
  const needs = (await Need.findAll({ include: [{ model: Recipient, as: 'recipient' }] })) as Array<Need & { recipient: Recipient }>;
  return needs.find((x) => x.recipient.kind === 'neonatal-unit' && x.sizeCategory === 'preemie')!;
}

beforeAll(async () => {
  t = await makeTestApp();
  vol = await signedIn(t.app, 'volunteer');
  organiser = await signedIn(t.app, 'organiser');
  hall = (await Site.findOne({ where: { name: 'Millrace Community Hall' } }))!;
});
afterAll(async () => t.close());

describe('a declined blanket leaves its place in the pledge', () => {
  it('makes a one-blanket pledge active (and late when due) again, and lets the maker log a replacement', async () => {
    const need = await preemieNeed();
    const p = await vol.post('/api/pledges', { needId: need.id, quantity: 1, sizeCategory: 'preemie', dueDate: need.deadline });
    expect(p.status).toBe(201);
    const pledgeId = p.body.pledge.id as number;
    const logged = await vol.post('/api/blankets', { ...goodPreemie, pledgeId, status: 'finished' });
    expect(logged.status, JSON.stringify(logged.body)).toBe(201);
    const blanketId = logged.body.id as number;
    expect((await vol.get(`/api/pledges/${pledgeId}`)).body.pledge.status).toBe('fulfilled');

    const got = await organiser.post(`/api/blankets/${blanketId}/intake`, { siteId: hall.id, widthCm: 45, lengthCm: 48 });
    expect(got.status).toBe(200);
    const declined = await organiser.post(`/api/blankets/${blanketId}/inspection`, {
      checklist: { ...allGoodChecklist, noSmokeOrPetOdour: false },
      outcome: 'declined',
    });
    expect(declined.status, JSON.stringify(declined.body)).toBe(200);

    const after = (await vol.get(`/api/pledges/${pledgeId}`)).body.pledge;
    expect(after).toMatchObject({ status: 'active', blanketsFinished: 0, blanketsLogged: 0, blanketsDeclined: 1 });
    // Past its date, an active pledge with nothing finished shows as late.
    await Pledge.update({ dueDate: day(-1) }, { where: { id: pledgeId } });
    expect((await vol.get(`/api/pledges/${pledgeId}`)).body.pledge.late).toBe(true);
    await Pledge.update({ dueDate: need.deadline }, { where: { id: pledgeId } });

    const replacement = await vol.post('/api/blankets', { ...goodPreemie, pledgeId, status: 'finished', colours: 'oat' });
    expect(replacement.status, JSON.stringify(replacement.body)).toBe(201);
    expect((await vol.get(`/api/pledges/${pledgeId}`)).body.pledge).toMatchObject({ status: 'fulfilled', blanketsLogged: 1, blanketsDeclined: 1 });
    // The place is taken again: a third blanket needs a bigger pledge.
    const third = await vol.post('/api/blankets', { ...goodPreemie, pledgeId });
    expect(third.status).toBe(409);

    // Reconsidering the declined blanket is a move back, and a move back without a reason is a 400,
    // the same as anywhere else a move lacks its reason.
    const noReason = await organiser.patch(`/api/blankets/${blanketId}`, { status: 'received' });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.issues[0].path).toBe('reason');
  });
});

/** Counts worked out from every blanket and pledge in the database, with none of the server's helpers. */
async function recount(needId: number) {
  const pledges = await Pledge.findAll({ where: { needId } });
  const blankets = await Blanket.findAll({ where: { pledgeId: pledges.map((p) => p.id) } });
  const promising = pledges.filter((p) => p.status === 'active' || p.status === 'fulfilled');
  const mine = blankets.filter((b) => promising.some((p) => p.id === b.pledgeId));
  const has = (list: readonly BlanketStatus[]) => mine.filter((b) => list.includes(b.status)).length;
  return {
    pledged: promising.reduce((n, p) => n + p.quantity, 0),
    finished: has(FINISHED_STATUSES),
    inHand: has(WITH_ORGANISERS),
    assigned: has(ASSIGNED_STATUSES),
  };
}

describe('every move keeps the pledge counts equal to a recount from scratch', () => {
  it('holds for random sequences of moves over a pledge’s blankets', async () => {
    const need = await preemieNeed();
    const maker = (await User.findOne({ where: { email: 'volunteer@example.org' } }))!;
    const staff = (await User.findOne({ where: { email: 'organiser@example.org' } }))!;
    const coordinator = (await User.findOne({ where: { email: 'coordinator@example.org' } }))!;
    const makerActor: Actor = { id: maker.id, role: maker.role };
    const actorFor = (by: readonly string[]): Actor =>
      by.includes('maker') ? makerActor : by.includes('organiser') ? { id: staff.id, role: 'organiser' } : { id: coordinator.id, role: 'coordinator' };
    let serial = 0;

    await fc.assert(
      fc.asyncProperty(
        fc.integer({ min: 1, max: 3 }),
        fc.integer({ min: 1, max: 3 }),
        fc.array(fc.tuple(fc.nat(), fc.nat()), { minLength: 1, maxLength: 25 }),
        async (quantity, howMany, steps) => {
          const pledge = await Pledge.create({ userId: maker.id, needId: need.id, quantity, sizeCategory: 'preemie', dueDate: need.deadline });
          const blankets: Blanket[] = [];
          for (let i = 0; i < Math.min(howMany, quantity); i++) {
            serial += 1;
            blankets.push(
              await Blanket.create({
                ...goodPreemie,
                fibres: ['acrylic'],
                features: [],
                labelName: 'first-name',
                code: `KL-PROP-${serial}`,
                userId: maker.id,
                pledgeId: pledge.id,
                recipientId: need.recipientId,
                status: 'in_progress',
              }),
            );
          }
          for (const [which, pick] of steps) {
            const b = blankets[which % blankets.length]!;
            const moves = STATUS_MOVES.filter((m) => m.from === b.status);
            if (moves.length === 0) continue;
            const move = moves[pick % moves.length]!;
            await t.sequelize.transaction((transaction) =>
              moveBlanket(
                { blanket: b, to: move.to, actor: actorFor(move.by), via: moveChannel(move), reason: move.direction === 'back' ? 'Checking the counts' : null },
                transaction,
              ),
            );
            const view = await pledgeView(pledge.id);
            const statuses = blankets.map((x) => x.status);
            const finished = statuses.filter((s) => FINISHED_STATUSES.includes(s)).length;
            expect(view.blanketsFinished).toBe(finished);
            expect(view.blanketsDeclined).toBe(statuses.filter((s) => s === 'declined').length);
            expect(view.blanketsLogged).toBe(statuses.filter((s) => s !== 'declined').length);
            expect(view.status).toBe(finished >= quantity ? 'fulfilled' : 'active');
            const counts = (await needCounts([need.id])).get(need.id)!;
            expect({ pledged: counts.pledged, finished: counts.finished, inHand: counts.inHand, assigned: counts.assigned }).toEqual(await recount(need.id));
          }
        },
      ),
      { numRuns: 15 },
    );
  });
});
