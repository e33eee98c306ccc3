import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedIn, type TestApp, type Client } from './test-app';
import { Session } from '../../server/db/models/session';
import { User } from '../../server/db/models/user';
import { Site } from '../../server/db/models/site';
import { TOUCH_EVERY_MS } from '../../server/app';

/**
 * What SQLite is asked to run for one signed-in read, seen through sqlite3's trace event on every
 * connection Sequelize uses (the default one and each transaction's). A statement answered from a
 * cache never reaches SQLite and so is not seen; one that runs is.
 */
type Traceable = { on(event: 'trace', listener: (sql: string) => void): void };

let t: TestApp;
const seen: string[] = [];

beforeAll(async () => {
  t = await makeTestApp();
  const manager = t.sequelize.connectionManager as unknown as { getConnection(o?: object): Promise<Traceable> };
  const traced = new WeakSet<Traceable>();
  const watch = (c: Traceable) => {
    if (traced.has(c)) return;
    traced.add(c);
    c.on('trace', (sql) => {
      if (!polled(sql)) seen.push(sql);
    });
  };
  const original = manager.getConnection.bind(manager);
  manager.getConnection = async (o?: object) => {
    const c = await original(o);
    watch(c);
    return c;
  };
  watch(await original({}));
});

/** The watch for other processes' commits (server/db/kept.ts) asks this on a timer, not per request. */
const polled = (sql: string) => /PRAGMA\s+data_version/i.test(sql);
afterAll(async () => t.close());

/** sqlite3 hands trace events over asynchronously; let those of earlier statements arrive first. */
const settle = () => new Promise((r) => setTimeout(r, 20));

async function statementsOf(c: Client, url: string) {
  await settle();
  seen.length = 0;
  const res = await c.get(url);
  expect(res.status).toBe(200);
  await settle();
  return [...seen];
}

const sessionWrites = (sql: string[]) => sql.filter((s) => /^\s*(UPDATE|INSERT INTO|INSERT OR|DELETE FROM)\s+`?sessions`?/i.test(s));
const tableInfo = (sql: string[]) => sql.filter((s) => /PRAGMA\s+table_info/i.test(s));

async function sessionOf(email: string) {
  const user = (await User.findOne({ where: { email } }))!;
  return (await Session.findAll()).find((r) => r.userId === user.id)!;
}

/** Makes a person's session stamp older than the renewal interval, as if a minute had passed. */
async function ageStamp(email: string) {
  const row = await sessionOf(email);
  const data = JSON.parse(row.data!);
  data.lastSeen = Date.now() - TOUCH_EVERY_MS - 1_000;
  await row.update({ data: JSON.stringify(data) });
}

describe('the cost of one signed-in read', () => {
  it('reads the session and the user once each after a write, and writes nothing', async () => {
    const c = await signedIn(t.app, 'volunteer');
    await c.get('/api/auth/me');
    // Any write drops the kept session rows and users (server/db/kept.ts).
    await User.update({ name: 'Priya Hollis' }, { where: { email: 'priya@example.org' } });
    const sql = await statementsOf(c, '/api/auth/me');
    expect(sessionWrites(sql)).toEqual([]);
    expect(tableInfo(sql)).toEqual([]);
    expect(sql.filter((s) => /\bFROM\s+`?sessions`?/i.test(s))).toHaveLength(1);
    expect(sql.filter((s) => /\bFROM\s+`?users`?/i.test(s))).toHaveLength(1);
    expect(sql).toHaveLength(2);
  });

  it('asks SQLite nothing for a second read with nothing written between', async () => {
    const c = await signedIn(t.app, 'volunteer');
    await c.get('/api/auth/me');
    expect(await statementsOf(c, '/api/auth/me')).toEqual([]);
  });

  it('asks no PRAGMA table_info and writes no session on the lists a page loads', async () => {
    const volunteer = await signedIn(t.app, 'volunteer');
    const organiser = await signedIn(t.app, 'organiser');
    const site = (await Site.findOne({ where: { active: true } }))!;
    const reads: Array<[Client, string]> = [
      [volunteer, '/api/blankets'],
      [volunteer, '/api/needs'],
      [volunteer, '/api/recipients'],
      [organiser, '/api/blankets'],
      [organiser, '/api/pledges'],
      [organiser, '/api/drive/progress'],
      [organiser, `/api/intake/queue?siteId=${site.id}`],
    ];
    for (const [c, url] of reads) await c.get(url);
    for (const [c, url] of reads) {
      const sql = await statementsOf(c, url);
      expect({ url, writes: sessionWrites(sql), pragmas: tableInfo(sql) }).toEqual({ url, writes: [], pragmas: [] });
    }
  });

  it(`renews a session's stamp once it is older than ${TOUCH_EVERY_MS / 1000} s, and only once`, async () => {
    const c = await signedIn(t.app, 'coordinator');
    await c.get('/api/auth/me');
    await ageStamp('coordinator@example.org');

    const renewing = await statementsOf(c, '/api/auth/me');
    expect(sessionWrites(renewing)).toHaveLength(1);
    const stamped = JSON.parse((await sessionOf('coordinator@example.org')).data!).lastSeen;
    expect(Date.now() - stamped).toBeLessThan(TOUCH_EVERY_MS);

    expect(sessionWrites(await statementsOf(c, '/api/auth/me'))).toEqual([]);
  });

  it('renews a stale stamp once when twenty requests arrive with it together', async () => {
    const c = await signedIn(t.app, 'hattie@example.org');
    await c.get('/api/auth/me');
    await ageStamp('hattie@example.org');
    await settle();
    seen.length = 0;
    const answers = await Promise.all(Array.from({ length: 20 }, () => c.get('/api/auth/me')));
    await settle();
    expect(answers.map((r) => r.status)).toEqual(Array(20).fill(200));
    expect(sessionWrites([...seen])).toHaveLength(1);
  });

  it('still refuses a user made inactive since signing in', async () => {
    const c = await signedIn(t.app, 'priya@example.org');
    expect((await c.get('/api/auth/me')).status).toBe(200);
    await User.update({ active: false }, { where: { email: 'priya@example.org' } });
    expect((await c.get('/api/auth/me')).status).toBe(401);
    await User.update({ active: true }, { where: { email: 'priya@example.org' } });
  });
});

describe('what a signed-in read sends besides the answer', () => {
  const sidCookie = (res: { headers: Record<string, unknown> }) =>
    ([] as string[]).concat((res.headers['set-cookie'] as string[] | undefined) ?? []).find((c) => c.startsWith('kindloop.sid='));

  it('sends the session cookie again when the stamp is renewed, not on every answer', async () => {
    // A user with no other session in this file, so that the row changed below is this client's.
    const c = await signedIn(t.app, 'felix@example.org');
    await c.get('/api/auth/me');
    const quiet = await c.get('/api/auth/me');
    expect(quiet.status).toBe(200);
    expect(sidCookie(quiet)).toBeUndefined();

    await ageStamp('felix@example.org');
    const renewed = await c.get('/api/auth/me');
    expect(renewed.status).toBe(200);
    const cookie = sidCookie(renewed);
    expect(cookie).toMatch(/HttpOnly/i);
    const expires = Date.parse(/Expires=([^;]+)/i.exec(cookie ?? '')?.[1] ?? '');
    // The cookie's expiry moves on with the renewal, a full idle limit from now.
    expect(expires).toBeGreaterThan(Date.now() + t.config.sessionIdleMinutes * 60_000 - 5_000);
  });

  it('gzips a large answer of a route that keeps none of its own, once', async () => {
    const c = await signedIn(t.app, 'coordinator');
    const plain = await c.get('/api/users').set('Accept-Encoding', 'identity');
    expect(plain.status).toBe(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(JSON.stringify(plain.body).length).toBeGreaterThan(1024);
    const zipped = await c.get('/api/users').set('Accept-Encoding', 'gzip');
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(zipped.body).toEqual(plain.body);
  });

  it('finds a route by its area in any letter case, and refuses an unknown area with JSON', async () => {
    const c = await signedIn(t.app, 'volunteer');
    expect((await c.get('/API/Auth/me')).status).toBe(200);
    const unknown = await c.get('/api/no-such-area');
    expect(unknown.status).toBe(404);
    expect(unknown.headers['content-type']).toMatch(/json/);
    // Security headers come with every answer, kept or not.
    const kept = await c.get('/api/needs');
    expect(kept.headers['content-security-policy']).toBeTruthy();
    expect(kept.headers['x-content-type-options']).toBe('nosniff');
  });
});
