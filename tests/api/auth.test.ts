import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Client, DEMO_PASSWORD, makeTestApp, signedIn, type TestApp } from './test-app';
import { MailMessage } from '../../server/db/models/mail-message';
import { User } from '../../server/db/models/user';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => t.close());

describe('sign-in', () => {
  it('signs a demo account in and reports who it is', async () => {
    const c = await signedIn(t.app, 'volunteer');
    const me = await c.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user).toMatchObject({ email: 'volunteer@example.org', role: 'volunteer' });
    expect(me.body.user.passwordHash).toBeUndefined();
  });

  it('answers 401 to /me when nobody is signed in', async () => {
    const res = await request(t.app).get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.body.error.message).toMatch(/sign in/i);
  });

  it('gives the same generic message for a wrong password and an unknown e-mail', async () => {
    const c = new Client(t.app);
    await c.refreshToken();
    const a = await c.post('/api/auth/login', { email: 'organiser@example.org', password: 'not-the-password' });
    const b = await c.post('/api/auth/login', { email: 'nobody@example.org', password: 'not-the-password' });
    expect(a.status).toBe(401);
    expect(b.status).toBe(401);
    expect(a.body.error.message).toBe('Wrong e-mail or password');
    expect(b.body.error.message).toBe(a.body.error.message);
  });

  it('regenerates the session id at sign-in (OWASP Session Management)', async () => {
    const c = new Client(t.app);
    const first = await c.agent.get('/api/auth/csrf');
    const before = String(first.headers['set-cookie']).match(/kindloop\.sid=([^;]+)/)?.[1];
    const res = await c.agent.post('/api/auth/login').set('X-CSRF-Token', first.body.csrfToken).send({ email: 'coordinator@example.org', password: DEMO_PASSWORD });
    const after = String(res.headers['set-cookie']).match(/kindloop\.sid=([^;]+)/)?.[1];
    expect(before).toBeTruthy();
    expect(after).toBeTruthy();
    expect(after).not.toBe(before);
    expect(String(res.headers['set-cookie'])).toMatch(/HttpOnly/i);
    expect(String(res.headers['set-cookie'])).toMatch(/SameSite=Lax/i);
  });

  it('signs out with 204 and forgets the user', async () => {
    const c = await signedIn(t.app, 'organiser');
    const out = await c.post('/api/auth/logout');
    expect(out.status).toBe(204);
    expect((await c.get('/api/auth/me')).status).toBe(401);
  });

  it('rate-limits repeated failures on one account with 429', async () => {
    const c = new Client(t.app);
    await c.refreshToken();
    const statuses: number[] = [];
    for (let i = 0; i < t.config.loginMaxFailures + 2; i++) {
      statuses.push((await c.post('/api/auth/login', { email: 'maren@example.org', password: 'wrong-wrong' })).status);
    }
    expect(statuses.slice(0, t.config.loginMaxFailures).every((s) => s === 401)).toBe(true);
    expect(statuses.at(-1)).toBe(429);
  });
});

describe('CSRF', () => {
  it('refuses a write without the X-CSRF-Token header with 403', async () => {
    const res = await request(t.app).post('/api/auth/login').send({ email: 'volunteer@example.org', password: DEMO_PASSWORD });
    expect(res.status).toBe(403);
  });
  it('refuses a token from another session', async () => {
    const a = new Client(t.app);
    const b = new Client(t.app);
    await a.refreshToken();
    await b.refreshToken();
    const res = await a.agent.post('/api/auth/login').set('X-CSRF-Token', b.token).send({ email: 'volunteer@example.org', password: DEMO_PASSWORD });
    expect(res.status).toBe(403);
  });
});

describe('registration', () => {
  it('creates a volunteer, signs them in and queues a welcome mail in the outbox', async () => {
    const c = new Client(t.app);
    await c.refreshToken();
    const res = await c.post('/api/auth/register', { name: 'New Maker', email: 'New.Maker@Example.org', password: 'a long enough passphrase' });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email: 'new.maker@example.org', role: 'volunteer' });
    const stored = await User.findOne({ where: { email: 'new.maker@example.org' } });
    expect(stored!.passwordHash).toMatch(/^scrypt\$10\$8\$1\$/);
    expect(await MailMessage.count({ where: { to: 'new.maker@example.org' } })).toBe(1);
  });
  it('names the field on bad input and writes nothing', async () => {
    const c = new Client(t.app);
    await c.refreshToken();
    const before = await User.count();
    const res = await c.post('/api/auth/register', { name: '', email: 'not-an-email', password: 'short' });
    expect(res.status).toBe(400);
    const paths = res.body.error.issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['name', 'email', 'password']));
    expect(await User.count()).toBe(before);
  });
  it('answers 409 for an e-mail already registered', async () => {
    const c = new Client(t.app);
    await c.refreshToken();
    const res = await c.post('/api/auth/register', { name: 'Again', email: 'volunteer@example.org', password: 'another passphrase' });
    expect(res.status).toBe(409);
  });
});

/** Polls until `read` gives something, for work that continues after the answer was sent. */
async function eventually<T>(read: () => Promise<T | null>, tries = 100): Promise<T> {
  for (let i = 0; i < tries; i++) {
    const v = await read();
    if (v) return v;
    await new Promise((r) => setTimeout(r, 20));
  }
  throw new Error('it never happened');
}

describe('password reset', () => {
  it('mails a single-use link that sets a new password and signs out old sessions', async () => {
    const old = await signedIn(t.app, 'tobias@example.org');
    const c = new Client(t.app);
    await c.refreshToken();
    const res = await c.post('/api/auth/password-reset', { email: 'tobias@example.org' });
    expect(res.status).toBe(202);
    // The answer goes first; the link is written just after it.
    const mail = await eventually(() => MailMessage.findOne({ where: { to: 'tobias@example.org' }, order: [['id', 'DESC']] }));
    const token = mail!.text.match(/token=([A-Za-z0-9_-]+)/)![1];
    const ok = await c.post('/api/auth/password-reset/confirm', { token, password: 'a brand new passphrase' });
    expect(ok.status).toBe(200);
    const again = await c.post('/api/auth/password-reset/confirm', { token, password: 'yet another passphrase' });
    expect(again.status).toBe(400);
    expect((await old.get('/api/auth/me')).status).toBe(401);
    expect((await new Client(t.app).login('tobias@example.org', 'a brand new passphrase')).status).toBe(200);
  });
  it('does not reveal whether an address has an account', async () => {
    const c = new Client(t.app);
    await c.refreshToken();
    const res = await c.post('/api/auth/password-reset', { email: 'no-such-person@example.org' });
    expect(res.status).toBe(202);
  });
});

describe('errors', () => {
  it('answers malformed JSON with 400 JSON, not an HTML stack', async () => {
    const c = new Client(t.app);
    await c.refreshToken();
    const res = await c.agent.post('/api/auth/login').set('X-CSRF-Token', c.token).set('Content-Type', 'application/json').send('{"email": ');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/JSON/);
  });
  it('answers an unknown API route with 404 JSON', async () => {
    const res = await request(t.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/json/);
    expect(res.body.error.message).toBeTruthy();
  });
});

describe('people and roles', () => {
  it('lets a coordinator change a role and deactivate an account, which then cannot sign in', async () => {
    const coord = await signedIn(t.app, 'coordinator');
    const list = await coord.get('/api/users');
    const ines = list.body.users.find((u: { email: string }) => u.email === 'ines@example.org');
    expect((await coord.patch(`/api/users/${ines.id}`, { role: 'organiser' })).body.user.role).toBe('organiser');
    expect((await coord.patch(`/api/users/${ines.id}`, { active: false })).status).toBe(200);
    expect((await new Client(t.app).login('ines@example.org')).status).toBe(401);
  });
  it('refuses a coordinator demoting themself', async () => {
    const coord = await signedIn(t.app, 'coordinator');
    const me = (await coord.get('/api/auth/me')).body.user;
    expect((await coord.patch(`/api/users/${me.id}`, { role: 'volunteer' })).status).toBe(409);
  });
  it('rejects an unknown role with 400 naming the field', async () => {
    const coord = await signedIn(t.app, 'coordinator');
    const res = await coord.patch('/api/users/5', { role: 'admin' });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('role');
  });
});

describe('idle sessions', () => {
  it('ends a session left unused longer than SESSION_IDLE_MINUTES, even if its cookie is replayed', async () => {
    const c = await signedIn(t.app, 'priya@example.org');
    expect((await c.get('/api/auth/me')).status).toBe(200);
    const { Session } = await import('../../server/db/models/session');
    const priya = (await User.findOne({ where: { email: 'priya@example.org' } }))!;
    const mine = (await Session.findAll()).find((r) => r.userId === priya.id);
    expect(mine).toBeTruthy();
    const data = JSON.parse(mine!.data!);
    data.lastSeen = Date.now() - (t.config.sessionIdleMinutes + 1) * 60_000;
    await mine!.update({ data: JSON.stringify(data) });
    expect((await c.get('/api/auth/me')).status).toBe(401);
  });
});

describe('cookies in production', () => {
  it('marks the session cookie Secure when NODE_ENV=production, behind a TLS proxy on loopback', async () => {
    const prod = await makeTestApp({ seed: false, env: { NODE_ENV: 'production' } });
    try {
      const res = await request(prod.app).get('/api/auth/csrf').set('X-Forwarded-Proto', 'https');
      expect(String(res.headers['set-cookie'])).toMatch(/kindloop\.sid=.*;.*Secure/i);
    } finally {
      await prod.close();
    }
  });
  it('sets a plain cookie by default, so `npm start` on http://127.0.0.1 can sign people in', async () => {
    const res = await request(t.app).get('/api/auth/csrf');
    expect(String(res.headers['set-cookie'])).toMatch(/kindloop\.sid=/);
    expect(String(res.headers['set-cookie'])).not.toMatch(/Secure/i);
  });
});
