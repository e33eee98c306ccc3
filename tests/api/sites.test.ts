import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';

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

const site = (over: object = {}) => ({ name: 'Weaver Street Café', address: '5 Weaver Street, Thimbleford', lat: 46.201, lng: -27.401, ...over });

describe('drop-off sites', () => {
  it('lists the demo sites with a pin each, for anyone signed in', async () => {
    const res = await volunteer.get('/api/sites');
    expect(res.status).toBe(200);
    expect(res.body.sites.map((s: { name: string }) => s.name)).toEqual(['Hollyhock Yarn Parlour', 'Millrace Community Hall', 'Thimbleford Library']);
    for (const s of res.body.sites) {
      expect(typeof s.lat).toBe('number');
      expect(typeof s.lng).toBe('number');
      expect(s.active).toBe(true);
    }
  });

  it('lets a coordinator add and change a site', async () => {
    const add = await coordinator.post('/api/sites', site({ notes: 'Ask at the counter' }));
    expect(add.status).toBe(201);
    expect(add.body.site).toMatchObject({ name: 'Weaver Street Café', notes: 'Ask at the counter', active: true });
    const patch = await coordinator.patch(`/api/sites/${add.body.site.id}`, { notes: '', lat: null, lng: null });
    expect(patch.status).toBe(200);
    expect(patch.body.site).toMatchObject({ notes: null, lat: null, lng: null });
    expect((await organiser.get(`/api/sites/${add.body.site.id}`)).body.site.lat).toBeNull();
  });

  it('refuses organisers and volunteers with 403 on writes', async () => {
    expect((await organiser.post('/api/sites', site())).status).toBe(403);
    expect((await volunteer.post('/api/sites', site())).status).toBe(403);
    expect((await organiser.patch('/api/sites/1', { name: 'Renamed' })).status).toBe(403);
    expect((await coordinator.get('/api/sites/1')).body.site.name).not.toBe('Renamed');
  });

  it('hides a closed site from volunteers but shows it to coordinators who ask', async () => {
    const add = await coordinator.post('/api/sites', site({ name: 'Closed Shed', active: false }));
    const forVolunteer = (await volunteer.get('/api/sites?active=all')).body.sites.map((s: { id: number }) => s.id);
    expect(forVolunteer).not.toContain(add.body.site.id);
    const forCoordinator = (await coordinator.get('/api/sites?active=false')).body.sites.map((s: { id: number }) => s.id);
    expect(forCoordinator).toContain(add.body.site.id);
  });

  it.each([
    [{ name: '   ' }, 'name'],
    [{ address: '' }, 'address'],
    [{ lng: 200 }, 'lng'],
    [{ lat: 'north' }, 'lat'],
    [{ lat: null }, 'lat'],
    [{ active: 'yes' }, 'active'],
  ])('answers 400 naming the field for %j', async (over, field) => {
    const res = await coordinator.post('/api/sites', site(over));
    expect(res.status).toBe(400);
    expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain(field);
  });

  it('answers 400 for an empty patch and 404 for a missing site', async () => {
    expect((await coordinator.patch('/api/sites/1', {})).status).toBe(400);
    expect((await coordinator.patch('/api/sites/99999', { name: 'Nowhere' })).status).toBe(404);
    expect((await coordinator.get('/api/sites/99999')).status).toBe(404);
  });
});
