import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, makeTestApp, signedIn, type TestApp } from './test-app';
import { Recipient } from '../../server/db/models/recipient';
import { plainBlanket } from '../fixtures/blankets';

let t: TestApp;
let volunteer: Client;
const ids: Record<string, number> = {};

beforeAll(async () => {
  t = await makeTestApp();
  volunteer = await signedIn(t.app, 'volunteer');
  for (const r of await Recipient.findAll()) ids[r.kind === 'care-home' ? r.name : r.kind] = r.id;
});
afterAll(async () => t.close());

/** A crib-sized acrylic blanket as a maker would log it; `over` may hold bad values on purpose. */
const crib = (over: object = {}) => ({ ...plainBlanket(), ...over });

describe('POST /api/guidelines/check', () => {
  it('passes a clean crib blanket for the family shelter, with the infant cautions and the facility line', async () => {
    const res = await volunteer.post('/api/guidelines/check', { recipientId: ids['family-shelter'], blanket: crib() });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ ok: true, verdict: 'ready', reasons: [] });
    expect(res.body.recipient).toMatchObject({ id: ids['family-shelter'], population: 'infant' });
    const cautions = res.body.cautions.map((c: { id: string }) => c.id);
    expect(cautions).toEqual(expect.arrayContaining(['infant.supervised-only', 'infant.small-parts', 'infant.no-cords', 'facility-policy']));
  });

  it('explains fringe on an infant blanket, offers the at-home fix and names where it fits as it is', async () => {
    const res = await volunteer.post('/api/guidelines/check', { recipientId: ids['family-shelter'], blanket: crib({ widthCm: 85, lengthCm: 105, features: ['fringe'] }) });
    expect(res.status).toBe(200);
    expect(res.body.ok).toBe(false);
    expect(res.body.verdict).toBe('mend');
    expect(res.body.reasons).toHaveLength(1);
    expect(res.body.reasons[0]).toMatchObject({ rule: 'feature.fringe' });
    expect(res.body.reasons[0].message).toMatch(/fringe/i);
    expect(res.body.reasons[0].fix).toMatch(/fringe/i);
    const also = res.body.alsoFits.map((a: { recipientId: number }) => a.recipientId);
    expect(also).toContain(ids['childrens-ward']);
    expect(also).not.toContain(ids['family-shelter']);
  });

  it('shows the elder cautions and the facility line for a care home', async () => {
    const res = await volunteer.post('/api/guidelines/check', { recipientId: ids['Tansy Court Care Home'], blanket: crib({ widthCm: 90, lengthCm: 120 }) });
    expect(res.status).toBe(200);
    expect(res.body.cautions.map((c: { id: string }) => c.id)).toEqual(['elder.no-trailing-fringe', 'elder.hot-wash', 'facility-policy']);
  });

  it('uses the unit\'s stored edits: the newborn unit takes nothing heavier than DK', async () => {
    const preemie = crib({ widthCm: 45, lengthCm: 45, yarnWeight: 4 });
    const res = await volunteer.post('/api/guidelines/check', { recipientId: ids['neonatal-unit'], blanket: preemie });
    expect(res.body.reasons.map((r: { rule: string }) => r.rule)).toEqual(['yarn-weight']);
    const light = await volunteer.post('/api/guidelines/check', { recipientId: ids['neonatal-unit'], blanket: { ...preemie, yarnWeight: 3 } });
    expect(light.body.verdict).toBe('ready');
  });

  it('declines what no recipient takes, saying every reason', async () => {
    const res = await volunteer.post('/api/guidelines/check', {
      recipientId: ids['neonatal-unit'],
      blanket: crib({ widthCm: 300, lengthCm: 390, fibres: ['mohair'], machineWashable: false, smokeFree: false }),
    });
    expect(res.body.verdict).toBe('decline');
    const rules = res.body.reasons.map((r: { rule: string }) => r.rule);
    expect(rules).toEqual(expect.arrayContaining(['size.width', 'size.length', 'fibre.refused', 'washable', 'smoke-free']));
    expect(res.body.alsoFits).toEqual([]);
  });

  it.each([
    [{ blanket: crib({ widthCm: 0 }) }, 'blanket.widthCm'],
    [{ blanket: crib({ lengthCm: 401 }) }, 'blanket.lengthCm'],
    [{ blanket: crib({ yarnWeight: 8 }) }, 'blanket.yarnWeight'],
    [{ blanket: crib({ fibres: [] }) }, 'blanket.fibres'],
    [{ blanket: crib({ features: ['glitter'] }) }, 'blanket.features.0'],
    [{ blanket: crib({ smokeFree: 'yes' }) }, 'blanket.smokeFree'],
    [{ recipientId: 'one' }, 'recipientId'],
  ])('answers 400 naming the field for %j', async (over, field) => {
    const res = await volunteer.post('/api/guidelines/check', { recipientId: ids['family-shelter'], blanket: crib(), ...over });
    expect(res.status).toBe(400);
    expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain(field);
  });

  it('answers 404 for a recipient that does not exist', async () => {
    const res = await volunteer.post('/api/guidelines/check', { recipientId: 99999, blanket: crib() });
    expect(res.status).toBe(404);
  });

  it('answers 401 when nobody is signed in', async () => {
    const anon = new Client(t.app);
    await anon.refreshToken();
    const res = await anon.post('/api/guidelines/check', { recipientId: 1, blanket: crib() });
    expect(res.status).toBe(401);
  });
});
