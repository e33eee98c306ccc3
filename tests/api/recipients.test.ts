import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { defaultGuidelines } from '@shared/guidelines/defaults';
import { Pledge } from '../../server/db/models/pledge';
import { User } from '../../server/db/models/user';
import { Need } from '../../server/db/models/need';

let t: TestApp;
let organiser: Client;
let coordinator: Client;
let volunteer: Client;

beforeAll(async () => {
  t = await makeTestApp();
  organiser = await signedIn(t.app, 'organiser');
  coordinator = await signedIn(t.app, 'coordinator');
  volunteer = await signedIn(t.app, 'volunteer');
});
afterAll(async () => t.close());

const newRecipient = (over: object = {}) => ({
  name: 'Pinecrest Toddler Room',
  kind: 'other',
  population: 'infant',
  address: '12 Example Row, Thimbleford',
  lat: 46.21,
  lng: -27.39,
  contactName: 'Ada Testwell',
  contactEmail: 'Pinecrest@Example.org',
  ...over,
});

describe('the demo recipients', () => {
  it('lists the seeded recipients of every kind with needs, guidelines and a plain summary', async () => {
    const res = await organiser.get('/api/recipients');
    expect(res.status).toBe(200);
    const kinds = res.body.recipients.map((r: { kind: string }) => r.kind);
    expect(new Set(kinds)).toEqual(new Set(['neonatal-unit', 'childrens-ward', 'family-shelter', 'care-home', 'hospice']));
    expect(kinds.filter((k: string) => k === 'care-home')).toHaveLength(2);
    for (const r of res.body.recipients) {
      expect(r.needs.length).toBeGreaterThan(0);
      expect(r.guidelines.population).toBe(r.population);
      expect(r.guidelineSummary[0]).toMatch(/^Sizes /);
      expect(r.contactEmail).toMatch(/@example\.org$/);
      expect(typeof r.lat).toBe('number');
    }
  });

  it('keeps each unit\'s own edits to the defaults, so no demo set is the bare default', async () => {
    const res = await organiser.get('/api/recipients');
    for (const r of res.body.recipients) expect(r.guidelines).not.toEqual(defaultGuidelines(r.population));
  });

  it('hides contact details and delivery notes from volunteers', async () => {
    const res = await volunteer.get('/api/recipients');
    expect(res.status).toBe(200);
    expect(res.body.recipients.length).toBeGreaterThan(0);
    for (const r of res.body.recipients) {
      expect(r).not.toHaveProperty('contactEmail');
      expect(r).not.toHaveProperty('deliveryNotes');
      expect(r.needs.length).toBeGreaterThan(0);
    }
  });

  it('answers 401 when nobody is signed in', async () => {
    expect((await request(t.app).get('/api/recipients')).status).toBe(401);
  });
});

describe('creating and editing recipients', () => {
  it('creates a recipient with the population defaults and lower-cases the e-mail', async () => {
    const res = await organiser.post('/api/recipients', newRecipient());
    expect(res.status).toBe(201);
    expect(res.body.recipient).toMatchObject({ name: 'Pinecrest Toddler Room', contactEmail: 'pinecrest@example.org', active: true });
    expect(res.body.recipient.guidelines).toEqual(defaultGuidelines('infant'));
    const again = await organiser.get(`/api/recipients/${res.body.recipient.id}`);
    expect(again.body.recipient.name).toBe('Pinecrest Toddler Room');
  });

  it('refuses volunteers with 403 and writes nothing', async () => {
    const before = (await organiser.get('/api/recipients?active=all')).body.recipients.length;
    const res = await volunteer.post('/api/recipients', newRecipient({ name: 'Should not exist' }));
    expect(res.status).toBe(403);
    const after = (await organiser.get('/api/recipients?active=all')).body.recipients.length;
    expect(after).toBe(before);
  });

  it.each([
    [{ name: '' }, 'name'],
    [{ kind: 'zoo' }, 'kind'],
    [{ population: 'toddler' }, 'population'],
    [{ lat: 123 }, 'lat'],
    [{ lat: 46.2, lng: null }, 'lng'],
    [{ contactEmail: 'not-an-address' }, 'contactEmail'],
    [{ guidelines: { ...defaultGuidelines('infant'), population: 'elder' } }, 'guidelines.population'],
    [{ guidelines: { ...defaultGuidelines('infant'), minWidthCm: 300, maxWidthCm: 10 } }, 'guidelines.maxWidthCm'],
  ])('answers 400 naming the field for %j', async (over, field) => {
    const res = await organiser.post('/api/recipients', newRecipient(over));
    expect(res.status).toBe(400);
    expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain(field);
  });

  it('patches a field, bumps the version and refuses a stale version with 409', async () => {
    const created = (await coordinator.post('/api/recipients', newRecipient({ name: 'Version Test' }))).body.recipient;
    const first = await coordinator.patch(`/api/recipients/${created.id}`, { deliveryNotes: 'Back door', version: created.version });
    expect(first.status).toBe(200);
    expect(first.body.recipient.deliveryNotes).toBe('Back door');
    expect(first.body.recipient.version).toBe(created.version + 1);
    const stale = await coordinator.patch(`/api/recipients/${created.id}`, { deliveryNotes: 'Front door', version: created.version });
    expect(stale.status).toBe(409);
    expect(stale.body.error.issues[0].path).toBe('version');
    const now = await coordinator.get(`/api/recipients/${created.id}`);
    expect(now.body.recipient.deliveryNotes).toBe('Back door');
  });

  it('refuses a pin with only one coordinate after a patch', async () => {
    const created = (await coordinator.post('/api/recipients', newRecipient({ name: 'Pin Test' }))).body.recipient;
    const res = await coordinator.patch(`/api/recipients/${created.id}`, { lat: null });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('lat');
  });

  it('follows a change of population in the guidelines without losing the edited rules', async () => {
    const created = (await coordinator.post('/api/recipients', newRecipient({ name: 'Population Test' }))).body.recipient;
    const g = { ...created.guidelines, toleranceValue: 7 };
    expect((await coordinator.put(`/api/recipients/${created.id}/guidelines`, g)).status).toBe(200);
    const res = await coordinator.patch(`/api/recipients/${created.id}`, { population: 'child' });
    expect(res.body.recipient.guidelines.population).toBe('child');
    expect(res.body.recipient.guidelines.toleranceValue).toBe(7);
  });

  it('hides an archived recipient from volunteers (404) but not from organisers', async () => {
    const created = (await coordinator.post('/api/recipients', newRecipient({ name: 'Archived Test', active: false }))).body.recipient;
    expect((await volunteer.get(`/api/recipients/${created.id}`)).status).toBe(404);
    expect((await organiser.get(`/api/recipients/${created.id}`)).status).toBe(200);
    const listed = (await volunteer.get('/api/recipients?active=all')).body.recipients.map((r: { id: number }) => r.id);
    expect(listed).not.toContain(created.id);
  });

  it('answers 404 for a recipient that does not exist and 400 for a bad id', async () => {
    expect((await organiser.get('/api/recipients/99999')).status).toBe(404);
    const bad = await organiser.get('/api/recipients/abc');
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe('id');
  });
});

describe('guideline sets', () => {
  it('replaces the whole set and the summary follows', async () => {
    const created = (await organiser.post('/api/recipients', newRecipient({ name: 'Guideline Test' }))).body.recipient;
    const g = { ...defaultGuidelines('infant'), yarnWeights: [3], refusedFeatures: ['fringe'] };
    const res = await organiser.put(`/api/recipients/${created.id}/guidelines`, g);
    expect(res.status).toBe(200);
    expect(res.body.recipient.guidelines).toEqual(g);
    expect(res.body.recipient.guidelineSummary).toContain('Yarn weight 3 (light)');
    expect(res.body.recipient.guidelineSummary).toContain('No fringe');
  });

  it('answers 400 naming the field for a bad set, and keeps the old one', async () => {
    const created = (await organiser.post('/api/recipients', newRecipient({ name: 'Bad Guideline Test' }))).body.recipient;
    const cases: Array<[object, string]> = [
      [{ yarnWeights: [] }, 'yarnWeights'],
      [{ yarnWeights: [9] }, 'yarnWeights.0'],
      [{ refusedFeatures: ['glitter'] }, 'refusedFeatures.0'],
      [{ toleranceValue: 50 }, 'toleranceValue'],
      [{ population: 'elder' }, 'population'],
    ];
    for (const [over, field] of cases) {
      const res = await organiser.put(`/api/recipients/${created.id}/guidelines`, { ...defaultGuidelines('infant'), ...over });
      expect(res.status, JSON.stringify(over)).toBe(400);
      expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain(field);
    }
    const now = await organiser.get(`/api/recipients/${created.id}`);
    expect(now.body.recipient.guidelines).toEqual(defaultGuidelines('infant'));
  });

  it('refuses volunteers with 403', async () => {
    const res = await volunteer.put('/api/recipients/1/guidelines', defaultGuidelines('preemie'));
    expect(res.status).toBe(403);
  });
});

describe('needs', () => {
  it('adds, changes and removes a need', async () => {
    const r = (await organiser.post('/api/recipients', newRecipient({ name: 'Needs Test' }))).body.recipient;
    const add = await organiser.post(`/api/recipients/${r.id}/needs`, { sizeCategory: 'crib', quantity: 12, deadline: '2031-03-01', preferences: 'Pastels' });
    expect(add.status).toBe(201);
    expect(add.body.need).toMatchObject({ sizeCategory: 'crib', quantity: 12, deadline: '2031-03-01', pledged: 0 });
    const patch = await organiser.patch(`/api/recipients/${r.id}/needs/${add.body.need.id}`, { quantity: 15 });
    expect(patch.status).toBe(200);
    expect(patch.body.need.quantity).toBe(15);
    const shown = await organiser.get(`/api/recipients/${r.id}`);
    expect(shown.body.recipient.needs.map((n: { quantity: number }) => n.quantity)).toEqual([15]);
    expect((await organiser.delete(`/api/recipients/${r.id}/needs/${add.body.need.id}`)).status).toBe(204);
    expect((await organiser.get(`/api/recipients/${r.id}`)).body.recipient.needs).toEqual([]);
  });

  it.each([
    [{ quantity: 0 }, 'quantity'],
    [{ quantity: 10_000 }, 'quantity'],
    [{ quantity: 2.5 }, 'quantity'],
    [{ sizeCategory: 'king' }, 'sizeCategory'],
    [{ deadline: '2031-02-30' }, 'deadline'],
    [{ deadline: 'next week' }, 'deadline'],
  ])('answers 400 naming the field for %j', async (over, field) => {
    const res = await organiser.post('/api/recipients/1/needs', { sizeCategory: 'preemie', quantity: 5, deadline: '2031-01-01', ...over });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe(field);
  });

  it('answers 404 for a need of another recipient', async () => {
    const list = (await organiser.get('/api/recipients')).body.recipients;
    const [a, b] = list.filter((r: { needs: unknown[] }) => r.needs.length > 0);
    const res = await organiser.patch(`/api/recipients/${b.id}/needs/${a.needs[0].id}`, { quantity: 3 });
    expect(res.status).toBe(404);
  });

  it('counts active pledges and will not delete a need that has them', async () => {
    const r = (await organiser.post('/api/recipients', newRecipient({ name: 'Pledged Need Test' }))).body.recipient;
    const need = (await organiser.post(`/api/recipients/${r.id}/needs`, { sizeCategory: 'baby', quantity: 10, deadline: '2031-03-01' })).body.need;
    const maker = await User.findOne({ where: { email: 'volunteer@example.org' } });
    await Pledge.create({ userId: maker!.id, needId: need.id, quantity: 3, sizeCategory: 'baby', dueDate: '2031-02-01' });
    await Pledge.create({ userId: maker!.id, needId: need.id, quantity: 4, sizeCategory: 'baby', dueDate: '2031-02-01', status: 'cancelled' });
    const shown = await organiser.get(`/api/recipients/${r.id}`);
    expect(shown.body.recipient.needs[0].pledged).toBe(3);
    const del = await organiser.delete(`/api/recipients/${r.id}/needs/${need.id}`);
    expect(del.status).toBe(409);
    expect(del.body.error.message).toMatch(/pledged 3 blankets/);
    expect(await Need.findByPk(need.id)).not.toBeNull();
  });

  it('refuses volunteers with 403', async () => {
    const res = await volunteer.post('/api/recipients/1/needs', { sizeCategory: 'preemie', quantity: 5, deadline: '2031-01-01' });
    expect(res.status).toBe(403);
  });
});
