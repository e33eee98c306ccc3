import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Recipient } from '../../server/db/models/recipient';
import { Need } from '../../server/db/models/need';
import { Site } from '../../server/db/models/site';
import { plainBlanket } from '../fixtures/blankets';

/** What makers may learn about recipients and sites that have stopped taking part: nothing at all. */
let t: TestApp;
let volunteer: Client;
let organiser: Client;
let coordinator: Client;
let closedRecipient: Recipient;
let closedSite: Site;

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

beforeAll(async () => {
  t = await makeTestApp();
  volunteer = await signedIn(t.app, 'volunteer');
  organiser = await signedIn(t.app, 'organiser');
  coordinator = await signedIn(t.app, 'coordinator');
  closedRecipient = (await Recipient.findOne({ where: { kind: 'hospice' } }))!;
  await closedRecipient.update({ active: false });
  closedSite = await Site.create({ name: 'Old Mill Shed', address: '4 Mill Lane, Thimbleford', lat: null, lng: null, notes: 'Key under the blue pot', active: false });
});
afterAll(async () => t.close());

describe('inactive recipients and sites are not found for makers', () => {
  it('POST /api/guidelines/check answers 404 to a maker for an inactive recipient, with no name or guidelines', async () => {
    const res = await volunteer.post('/api/guidelines/check', { recipientId: closedRecipient.id, blanket: plainBlanket() });
    expect(res.status).toBe(404);
    expect(JSON.stringify(res.body)).not.toContain(closedRecipient.name);
    expect(res.body).not.toHaveProperty('guidelines');
    // The same answer as for a recipient that never existed.
    const none = await volunteer.post('/api/guidelines/check', { recipientId: 999_999, blanket: plainBlanket() });
    expect(none.status).toBe(404);
    expect(res.body).toEqual(none.body);
  });

  it('staff still check against an inactive recipient (intake may hold its blankets)', async () => {
    const res = await organiser.post('/api/guidelines/check', { recipientId: closedRecipient.id, blanket: plainBlanket() });
    expect(res.status).toBe(200);
    expect(res.body.recipient).toMatchObject({ id: closedRecipient.id, active: false });
  });

  it('GET /api/sites/:id answers 404 to a maker for a closed site, and its notes stay hidden', async () => {
    const res = await volunteer.get(`/api/sites/${closedSite.id}`);
    expect(res.status).toBe(404);
    expect(JSON.stringify(res.body)).not.toMatch(/Key under|Old Mill/);
    const none = await volunteer.get('/api/sites/999999');
    expect(res.body).toEqual(none.body);
    expect((await coordinator.get(`/api/sites/${closedSite.id}`)).body.site.notes).toBe('Key under the blue pot');
    expect((await organiser.get(`/api/sites/${closedSite.id}`)).status).toBe(200);
  });

  it('an open site still answers a maker', async () => {
    const open = (await Site.findOne({ where: { active: true } }))!;
    expect((await volunteer.get(`/api/sites/${open.id}`)).status).toBe(200);
  });

  it('the 409 for pledging against an inactive recipient does not name it', async () => {
    const need = (await Need.findOne({ where: { recipientId: closedRecipient.id } }))!;
    const res = await volunteer.post('/api/pledges', { needId: need.id, quantity: 1, sizeCategory: need.sizeCategory, dueDate: day(5) });
    expect(res.status).toBe(409);
    expect(res.body.error.issues[0].path).toBe('needId');
    expect(JSON.stringify(res.body)).not.toContain(closedRecipient.name);
  });
});
