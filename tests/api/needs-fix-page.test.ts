import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Need } from '../../server/db/models/need';
import { Recipient } from '../../server/db/models/recipient';
import { Site } from '../../server/db/models/site';
import type { BlanketDetail } from '@shared/schemas/blanket-log';
import { allGoodChecklist } from '../fixtures/blankets';

let t: TestApp;
let vol: Client;
let organiser: Client;
let hall: Site;

/** A preemie blanket the demo newborn unit takes as it is. */
const goodPreemie = {
  widthCm: 45,
  lengthCm: 48,
  yarnWeight: 3,
  fibres: ['acrylic'],
  colours: 'sage and cream',
  bodyStitch: 'hdc',
  features: [],
  machineWashable: true,
  dryerSafe: true,
  smokeFree: true,
  petFree: true,
  labelName: 'first-name',
  notes: '',
};

beforeAll(async () => {
  t = await makeTestApp();
  vol = await signedIn(t.app, 'volunteer');
  organiser = await signedIn(t.app, 'organiser');
  hall = (await Site.findOne({ where: { name: 'Millrace Community Hall' } }))!;
});
afterAll(async () => t.close());

async function loggedPreemie(): Promise<BlanketDetail> {
  const needs = (await Need.findAll({ include: [{ model: Recipient, as: 'recipient' }] })) as Array<Need & { recipient: Recipient }>;
  const need = needs.find((x) => x.recipient.kind === 'neonatal-unit' && x.sizeCategory === 'preemie')!;
  const p = await vol.post('/api/pledges', { needId: need.id, quantity: 1, sizeCategory: 'preemie', dueDate: need.deadline });
  expect(p.status).toBe(201);
  const b = await vol.post('/api/blankets', { ...goodPreemie, pledgeId: p.body.pledge.id, status: 'finished' });
  expect(b.status, JSON.stringify(b.body)).toBe(201);
  return b.body.blanket;
}

describe("the maker's page of a blanket that needs a fix", () => {
  it("says what the organisers found and asked for, and what they measured", async () => {
    const b = await loggedPreemie();
    expect(b.inspection).toBeNull();
    expect(b.measured).toBeNull();
    expect((await organiser.post(`/api/blankets/${b.id}/intake`, { siteId: hall.id, widthCm: 46, lengthCm: 47 })).status).toBe(200);
    const fix = await organiser.post(`/api/blankets/${b.id}/inspection`, {
      checklist: { ...allGoodChecklist, endsWovenIn: false },
      outcome: 'needs_fix',
      fixNote: 'Two ends near the corner are loose.',
    });
    expect(fix.status, JSON.stringify(fix.body)).toBe(200);

    const page = (await vol.get(`/api/blankets/${b.id}`)).body.blanket as BlanketDetail;
    expect(page.status).toBe('needs_fix');
    expect(page.measured).toEqual({ widthCm: 46, lengthCm: 47 });
    // What the maker logged is kept as they logged it.
    expect({ widthCm: page.widthCm, lengthCm: page.lengthCm }).toEqual({ widthCm: 45, lengthCm: 48 });
    expect(page.inspection).toMatchObject({
      outcome: 'needs_fix',
      recipientName: expect.stringMatching(/\w/),
      findings: ['Not so: ends woven in.'],
      fixes: ['Weave in the loose yarn ends securely, so none can be pulled out.'],
      note: 'Two ends near the corner are loose.',
    });

    // Once the maker has fixed it at home, the page no longer shows the old findings.
    expect((await vol.patch(`/api/blankets/${b.id}`, { status: 'finished' })).status).toBe(200);
    expect(((await vol.get(`/api/blankets/${b.id}`)).body.blanket as BlanketDetail).inspection).toBeNull();
  });

  it('runs the self-check on the size measured at the table, not the size logged', async () => {
    const b = await loggedPreemie();
    expect(b.selfCheck?.verdict).toBe('ready');
    // Measured far larger than logged: the unit's preemie size no longer holds.
    expect((await organiser.post(`/api/blankets/${b.id}/intake`, { siteId: hall.id, widthCm: 110, lengthCm: 140 })).status).toBe(200);
    const page = (await vol.get(`/api/blankets/${b.id}`)).body.blanket as BlanketDetail;
    expect(page.measured).toEqual({ widthCm: 110, lengthCm: 140 });
    expect(page.selfCheck?.verdict).not.toBe('ready');
    expect(page.selfCheck?.reasons.some((r) => /size|width|length|cm/i.test(`${r.rule} ${r.message}`))).toBe(true);
  });

  it('shows the demo’s needs-a-fix blanket with its reason', async () => {
    const mine = await vol.get('/api/blankets?status=needs_fix&mine=true');
    const any = (mine.body.items as Array<{ id: number }>)[0] ?? ((await organiser.get('/api/blankets?status=needs_fix')).body.items as Array<{ id: number }>)[0];
    expect(any).toBeDefined();
    const page = (await organiser.get(`/api/blankets/${any!.id}`)).body.blanket as BlanketDetail;
    expect(page.inspection?.findings.length).toBeGreaterThan(0);
  });
});
