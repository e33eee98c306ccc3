import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import request from 'supertest';
import sqlite3 from 'sqlite3';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { OTHER_WRITERS_EVERY_MS } from '../../server/db/kept';
import { cookieValue } from '../../server/lib/kept-door';
import { Need } from '../../server/db/models/need';
import { TOUCH_EVERY_MS } from '../../server/app';

/**
 * Kept answers handed out at the door (server/lib/kept-door.ts): the same session asking again for
 * the same URL, with nothing written since, gets the same answer before the session, passport and
 * the router run. These are the cases where handing it out there would be wrong, and the proof
 * that it is handed out there at all (the door's count of answers it served).
 */
let t: TestApp;
let vol: Client;

beforeAll(async () => {
  t = await makeTestApp();
  vol = await signedIn(t.app, 'volunteer');
});
afterAll(async () => {
  await t.close();
});

const served = () => t.app.locals.door.served;
const cookieOf = async (c: Client) => (await c.get('/api/auth/me')).request.cookies as string;
/**
 * Waits out the quarter-second poll that also sees commits made on the process's other connections
 * (server/db/kept.ts), so that a write of an earlier step cannot close the door during a count.
 */
const settled = () => new Promise((resolve) => setTimeout(resolve, OTHER_WRITERS_EVERY_MS * 3));
/** Headers that differ between any two answers whatever their route. */
const comparable = (headers: Record<string, string>) => {
  const { date: _date, ...rest } = headers;
  return rest;
};

describe('an answer handed out at the door', () => {
  it('is the same bytes and headers as the route sent, security headers included, without the route', async () => {
    await settled();
    const first = await vol.get('/api/blankets').set('Accept-Encoding', 'identity');
    const before = served();
    const second = await vol.get('/api/blankets').set('Accept-Encoding', 'identity');
    expect(served()).toBe(before + 1);
    expect(second.status).toBe(200);
    expect(second.text).toBe(first.text);
    expect(comparable(second.headers)).toEqual(comparable(first.headers));
    expect(second.headers['content-security-policy']).toMatch(/default-src 'self'/);
  });

  it('answers 304 to a client that sends the ETag back, and gzip to one that accepts it', async () => {
    await settled();
    const plain = await vol.get('/api/needs').set('Accept-Encoding', 'identity');
    await vol.get('/api/needs');
    const before = served();
    const again = await vol.get('/api/needs').set('If-None-Match', plain.headers.etag as string);
    expect(again.status).toBe(304);
    expect(again.text).toBe('');
    const zipped = await vol.get('/api/needs').set('Accept-Encoding', 'gzip');
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(zipped.text).toBe(plain.text);
    const unzipped = await vol.get('/api/needs').set('Accept-Encoding', 'identity');
    expect(unzipped.headers['content-encoding']).toBeUndefined();
    expect(unzipped.text).toBe(plain.text);
    expect(served()).toBe(before + 3);
  });

  it("never hands one person's answer to another, even for the same URL", async () => {
    const other = await signedIn(t.app, 'priya@example.org');
    const mine = await vol.get('/api/blankets');
    await vol.get('/api/blankets');
    const theirs = await other.get('/api/blankets');
    expect(theirs.status).toBe(200);
    expect(theirs.text).not.toBe(mine.text);
    expect((await other.get('/api/blankets')).text).toBe(theirs.text);
  });

  it('refuses a cookie whose signature was tampered with', async () => {
    const cookie = await cookieOf(vol);
    await vol.get('/api/recipients');
    await vol.get('/api/recipients');
    const raw = cookieValue(cookie, 'kindloop.sid')!;
    const forged = `kindloop.sid=${encodeURIComponent(`${raw.slice(0, -3)}${raw.endsWith('AAA') ? 'BBB' : 'AAA'}`)}`;
    const before = served();
    const res = await request(t.app).get('/api/recipients').set('Cookie', forged);
    expect(res.status).toBe(401);
    expect(served()).toBe(before);
  });

  it('refuses a cookie replayed after its session signed out', async () => {
    const c = await signedIn(t.app, 'coordinator');
    const cookie = await cookieOf(c);
    expect((await c.get('/api/recipients')).status).toBe(200);
    expect((await request(t.app).get('/api/recipients').set('Cookie', cookie)).status).toBe(200);
    expect((await c.post('/api/auth/logout')).status).toBeLessThan(300);
    expect((await request(t.app).get('/api/recipients').set('Cookie', cookie)).status).toBe(401);
  });

  it("stays open through another session's sign-in and sign-out, and closes on this session's own", async () => {
    const c = await signedIn(t.app, 'coordinator');
    const cookie = await cookieOf(c);
    const ask = () => request(t.app).get('/api/recipients').set('Cookie', cookie);
    await settled();
    expect((await ask()).status).toBe(200);
    expect((await ask()).status).toBe(200);
    // Someone else signs in and out: only the sessions table is written.
    const other = await signedIn(t.app, 'organiser');
    expect((await other.post('/api/auth/logout')).status).toBeLessThan(300);
    await settled();
    const before = served();
    expect((await ask()).status).toBe(200);
    expect(served()).toBe(before + 1);
    expect((await c.post('/api/auth/logout')).status).toBeLessThan(300);
    expect((await ask()).status).toBe(401);
    expect(served()).toBe(before + 1);
  });

  it('refuses a person deactivated meanwhile', async () => {
    const maker = await signedIn(t.app, 'priya@example.org');
    const coordinator = await signedIn(t.app, 'coordinator');
    const me = (await maker.get('/api/auth/me')).body.user as { id: number };
    expect((await maker.get('/api/needs')).status).toBe(200);
    expect((await maker.get('/api/needs')).status).toBe(200);
    expect((await coordinator.patch(`/api/users/${me.id}`, { active: false })).status).toBe(200);
    expect((await maker.get('/api/needs')).status).toBe(401);
    expect((await coordinator.patch(`/api/users/${me.id}`, { active: true })).status).toBe(200);
  });

  it('is not used for a write to the same URL', async () => {
    await vol.get('/api/blankets');
    await vol.get('/api/blankets');
    const before = served();
    const res = await vol.post('/api/blankets', {});
    expect(res.status).toBe(400);
    expect(served()).toBe(before);
  });

  it('is read again after a write, and after a write by another process', async () => {
    const first = (await vol.get('/api/needs')).body.needs as Array<{ id: number; quantity: number }>;
    await vol.get('/api/needs');
    const need = first[0]!;
    await Need.update({ quantity: need.quantity + 3 }, { where: { id: need.id } });
    const before = served();
    const after = (await vol.get('/api/needs')).body.needs as Array<{ id: number; quantity: number }>;
    expect(after.find((n) => n.id === need.id)!.quantity).toBe(need.quantity + 3);
    expect(served()).toBe(before);

    await vol.get('/api/needs');
    const other = new sqlite3.Database(t.config.databasePath);
    await new Promise<void>((resolve, reject) => other.run('UPDATE needs SET quantity = quantity + 2 WHERE id = ?', [need.id], (err) => (err ? reject(err) : resolve())));
    await new Promise<void>((resolve) => other.close(() => resolve()));
    await new Promise((r) => setTimeout(r, OTHER_WRITERS_EVERY_MS * 3));
    const seen = (await vol.get('/api/needs')).body.needs as Array<{ id: number; quantity: number }>;
    expect(seen.find((n) => n.id === need.id)!.quantity).toBe(need.quantity + 5);
  });

  it("lets the request through once the session's stamp is due, which renews it", async () => {
    const sid = /^s:([^.]+)\./.exec(cookieValue(await cookieOf(vol), 'kindloop.sid')!)![1]!;
    const stamp = async () => {
      const [rows] = await t.sequelize.query('SELECT data FROM sessions WHERE sid = ?', { replacements: [sid] });
      return (JSON.parse((rows as Array<{ data: string }>)[0]!.data) as { lastSeen: number }).lastSeen;
    };
    await settled();
    await vol.get('/api/recipients');
    await vol.get('/api/recipients');
    const stamped = await stamp();
    const realNow = Date.now;
    const now = vi.spyOn(Date, 'now').mockImplementation(() => realNow() + TOUCH_EVERY_MS + 1_000);
    try {
      const before = served();
      expect((await vol.get('/api/recipients')).status).toBe(200);
      expect(served()).toBe(before);
      await vi.waitFor(async () => expect(await stamp()).toBeGreaterThan(stamped));
      // Renewed, the next request is handed out at the door again.
      await vol.get('/api/recipients');
      await vol.get('/api/recipients');
      expect(served()).toBe(before + 1);
    } finally {
      now.mockRestore();
    }
  });
});

describe('the cookie the door reads', () => {
  it('is the first of its name, unquoted and URI-decoded, as express-session reads it', () => {
    expect(cookieValue('a=1; kindloop.sid=s%3Aabc.def; b=2', 'kindloop.sid')).toBe('s:abc.def');
    expect(cookieValue('kindloop.sid="s%3Aabc.def"', 'kindloop.sid')).toBe('s:abc.def');
    expect(cookieValue('kindloop.sid=first;kindloop.sid=second', 'kindloop.sid')).toBe('first');
    expect(cookieValue('xkindloop.sid=no; other=1', 'kindloop.sid')).toBeUndefined();
    expect(cookieValue('kindloop.sid=%E0%A4%A', 'kindloop.sid')).toBeUndefined();
    expect(cookieValue(undefined, 'kindloop.sid')).toBeUndefined();
  });
});
