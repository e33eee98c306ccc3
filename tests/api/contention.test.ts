import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import type { InferCreationAttributes } from 'sequelize';
import { makeTestApp, signedIn, Client, type TestApp } from './test-app';
import { Blanket } from '../../server/db/models/blanket';
import { Need } from '../../server/db/models/need';
import { Photo } from '../../server/db/models/photo';
import { Pledge } from '../../server/db/models/pledge';
import { Recipient } from '../../server/db/models/recipient';
import { Site } from '../../server/db/models/site';
import { User } from '../../server/db/models/user';
import { codeFromBytes } from '@shared/blankets/code';
import { MAX_PHOTOS_PER_BLANKET } from '@shared/schemas/blanket-log';
import { allGoodChecklist, plainBlanket } from '../fixtures/blankets';

/**
 * Twenty people pressing the same button at once. Each race must end with exactly the allowed
 * winners; everyone else gets a 409 with words a person understands, and nobody gets a 5xx.
 */
const RACERS = 20;

let t: TestApp;
let organisers: Client[];
let volunteer: Client;
let maker: User;
let hall: Site;
let shelterId: number;

type Res = { status: number; body: { error?: { message?: string } } };

function tally(results: Res[]) {
  const by = new Map<number, number>();
  for (const r of results) by.set(r.status, (by.get(r.status) ?? 0) + 1);
  return by;
}

function expectRace(results: Res[], winners: number, winStatus: number) {
  const by = tally(results);
  expect([...by.keys()].filter((s) => s >= 500), `server errors in ${JSON.stringify([...by])}`).toEqual([]);
  expect(by.get(winStatus) ?? 0).toBe(winners);
  expect(by.get(409) ?? 0).toBe(results.length - winners);
  for (const r of results.filter((x) => x.status === 409)) {
    expect(r.body.error?.message ?? '').toMatch(/[a-z]{3,} [a-z]{2,}/i);
    expect(r.body.error?.message ?? '').not.toMatch(/SQLITE|constraint|sequelize/i);
  }
}

let codeCounter = 0;
async function finishedBlanket() {
  const n = codeCounter++;
  return Blanket.create({
    code: codeFromBytes(Uint8Array.from([9, 1, (n >> 5) & 31, n & 31])),
    userId: maker.id,
    recipientId: shelterId,
    status: 'finished',
    ...plainBlanket(),
  } as unknown as InferCreationAttributes<Blanket>);
}

beforeAll(async () => {
  t = await makeTestApp();
  // Several organisers' sessions, as at a busy drop-off desk; one sign-in shared by many tabs too.
  const org = await signedIn(t.app, 'organiser');
  const coord = await signedIn(t.app, 'coordinator');
  organisers = [org, coord];
  volunteer = await signedIn(t.app, 'volunteer');
  maker = (await User.findOne({ where: { email: 'volunteer@example.org' } }))!;
  hall = (await Site.findOne({ where: { name: 'Millrace Community Hall' } }))!;
  shelterId = (await Recipient.findOne({ where: { kind: 'family-shelter' } }))!.id;
});

afterAll(async () => {
  await t.close();
});

const staff = (i: number) => organisers[i % organisers.length]!;

describe('20 simultaneous writes', () => {
  it('pledging against the same need: every pledge is kept, none fails', async () => {
    const need = (await Need.findAll({ include: [{ model: Recipient, as: 'recipient' }] })).find(
      (n) => (n as Need & { recipient: Recipient }).recipient.kind === 'family-shelter',
    )!;
    const makers = await Promise.all(['maren', 'tobias', 'ines', 'priya', 'agnes'].map((m) => signedIn(t.app, `${m}@example.org`)));
    const before = await Pledge.count({ where: { needId: need.id } });
    const results = await Promise.all(
      Array.from({ length: RACERS }, (_, i) =>
        makers[i % makers.length]!.post('/api/pledges', { needId: need.id, quantity: 1, sizeCategory: need.sizeCategory, dueDate: need.deadline }),
      ),
    );
    expectRace(results, RACERS, 201);
    expect(await Pledge.count({ where: { needId: need.id } })).toBe(before + RACERS);
  });

  it('logging blankets under a pledge for 3: exactly 3 are logged', async () => {
    const need = (await Need.findAll({ include: [{ model: Recipient, as: 'recipient' }] })).find(
      (n) => (n as Need & { recipient: Recipient }).recipient.kind === 'family-shelter',
    )!;
    const p = await volunteer.post('/api/pledges', { needId: need.id, quantity: 3, sizeCategory: need.sizeCategory, dueDate: need.deadline });
    expect(p.status).toBe(201);
    const pledgeId = p.body.pledge.id;
    const results = await Promise.all(
      Array.from({ length: RACERS }, () => volunteer.post('/api/blankets', { pledgeId, ...plainBlanket(), status: 'finished' })),
    );
    expectRace(results, 3, 201);
    expect(await Blanket.count({ where: { pledgeId } })).toBe(3);
  });

  it('receiving one blanket: one receipt, and the rest are told it was already received', async () => {
    const b = await finishedBlanket();
    const results = await Promise.all(
      Array.from({ length: RACERS }, (_, i) =>
        staff(i).post(`/api/blankets/${b.id}/intake`, { siteId: hall.id, widthCm: b.widthCm, lengthCm: b.lengthCm }),
      ),
    );
    expectRace(results, 1, 200);
    expect(results.find((r) => r.status === 409)!.body.error!.message).toMatch(/already received/);
  });

  it('inspecting one received blanket: one inspection is recorded', async () => {
    const b = await finishedBlanket();
    expect((await staff(0).post(`/api/blankets/${b.id}/intake`, { siteId: hall.id, widthCm: b.widthCm, lengthCm: b.lengthCm })).status).toBe(200);
    const results = await Promise.all(
      Array.from({ length: RACERS }, (_, i) =>
        staff(i).post(`/api/blankets/${b.id}/inspection`, { checklist: allGoodChecklist, outcome: 'checked' }),
      ),
    );
    expectRace(results, 1, 200);
    expect((await Blanket.findByPk(b.id))!.status).toBe('checked');
  });

  it(`uploading photos to one blanket: at most ${MAX_PHOTOS_PER_BLANKET} are kept`, async () => {
    const need = (await Need.findAll({ include: [{ model: Recipient, as: 'recipient' }] })).find(
      (n) => (n as Need & { recipient: Recipient }).recipient.kind === 'family-shelter',
    )!;
    const p = await volunteer.post('/api/pledges', { needId: need.id, quantity: 1, sizeCategory: need.sizeCategory, dueDate: need.deadline });
    const b = await volunteer.post('/api/blankets', { pledgeId: p.body.pledge.id, ...plainBlanket() });
    expect(b.status).toBe(201);
    const id = b.body.blanket.id;
    const jpeg = await sharp({ create: { width: 320, height: 240, channels: 3, background: { r: 120, g: 90, b: 60 } } }).jpeg().toBuffer();
    const results = await Promise.all(
      Array.from({ length: RACERS }, (_, i) =>
        volunteer.agent
          .post(`/api/blankets/${id}/photos`)
          .set('X-CSRF-Token', volunteer.token)
          .attach('photos', jpeg, { filename: `photo-${i}.jpg`, contentType: 'image/jpeg' }),
      ),
    );
    expectRace(results, MAX_PHOTOS_PER_BLANKET, 201);
    expect(await Photo.count({ where: { blanketId: id } })).toBe(MAX_PHOTOS_PER_BLANKET);
  });

  it('registering the same address: one account, the rest told it is taken', async () => {
    const clients = await Promise.all(
      Array.from({ length: RACERS }, async () => {
        const c = new Client(t.app);
        await c.refreshToken();
        return c;
      }),
    );
    const results = await Promise.all(
      clients.map((c) => c.post('/api/auth/register', { name: 'Quick Maker', email: 'quick.maker@example.org', password: 'a long enough passphrase' })),
    );
    expectRace(results, 1, 201);
    expect(await User.count({ where: { email: 'quick.maker@example.org' } })).toBe(1);
  });
});
