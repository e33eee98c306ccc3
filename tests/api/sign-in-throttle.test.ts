import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, DEMO_PASSWORD, makeTestApp, type TestApp } from './test-app';
import { MailMessage } from '../../server/db/models/mail-message';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => t.close());

/** Polls until `read` gives something, for work that continues after the answer was sent. */
async function eventually<T>(read: () => Promise<T | null>, tries = 100): Promise<T> {
  for (let i = 0; i < tries; i++) {
    const v = await read();
    if (v) return v;
    await new Promise((r) => setTimeout(r, 20));
  }
  throw new Error('it never happened');
}

describe('throttling by account and address together (OWASP Authentication Cheat Sheet, login throttling)', () => {
  const from = async (ip: string) => {
    const c = new Client(t.app);
    await c.refreshToken();
    return {
      c,
      post: (url: string, body: object) => c.agent.post(url).set('X-Forwarded-For', ip).set('X-CSRF-Token', c.token).send(body),
    };
  };

  it("someone guessing a maker's password from one address does not lock the maker out from theirs", async () => {
    const attacker = await from('203.0.113.7');
    const statuses: number[] = [];
    for (let i = 0; i < t.config.loginMaxFailures + 1; i++) {
      statuses.push((await attacker.post('/api/auth/login', { email: 'priya@example.org', password: 'a wrong guess here' })).status);
    }
    expect(statuses.at(-1)).toBe(429);
    // The attacker is slowed even with the right password...
    expect((await attacker.post('/api/auth/login', { email: 'priya@example.org', password: DEMO_PASSWORD })).status).toBe(429);
    // ...while the maker, from their own address, signs in at once.
    const maker = await from('198.51.100.20');
    expect((await maker.post('/api/auth/login', { email: 'priya@example.org', password: DEMO_PASSWORD })).status).toBe(200);
  });

  it('one address trying many accounts is slowed across all of them', async () => {
    const sprayer = await from('203.0.113.8');
    const statuses: number[] = [];
    for (let i = 0; i < t.config.loginMaxFailures * 3 + 1; i++) {
      statuses.push((await sprayer.post('/api/auth/login', { email: `someone${i}@example.org`, password: 'a wrong guess here' })).status);
    }
    expect(statuses.slice(0, t.config.loginMaxFailures * 3).every((s) => s === 401)).toBe(true);
    expect(statuses.at(-1)).toBe(429);
  });

  it('answers a reset request before looking the address up: known and unknown alike, while the database is busy', async () => {
    let release!: () => void;
    const held = new Promise<void>((r) => (release = r));
    const client = await from('198.51.100.30');
    // Hold the one write queue (docs/decisions/0005), so a route that waited for its lookup and its
    // write before answering could not answer at all.
    const queue = (t.sequelize as unknown as { writeQueue: { run: (work: () => Promise<void>) => Promise<void> } }).writeQueue;
    const holder = queue.run(() => held);
    try {
      const before = await MailMessage.count();
      const known = await client.post('/api/auth/password-reset', { email: 'volunteer@example.org' });
      const unknown = await client.post('/api/auth/password-reset', { email: 'nobody-here@example.org' });
      expect([known.status, unknown.status]).toEqual([202, 202]);
      expect(known.body).toEqual(unknown.body);
      expect(await MailMessage.count()).toBe(before);
    } finally {
      release();
      await holder;
    }
    await eventually(() => MailMessage.findOne({ where: { to: 'volunteer@example.org', subject: 'Reset your Kindloop password' } }));
    expect(await MailMessage.count({ where: { to: 'nobody-here@example.org' } })).toBe(0);
  });

  it('limits reset requests for one address from one client, not from everyone', async () => {
    const a = await from('203.0.113.9');
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) statuses.push((await a.post('/api/auth/password-reset', { email: 'maren@example.org' })).status);
    expect(statuses).toEqual([202, 202, 202, 429]);
    const b = await from('198.51.100.31');
    expect((await b.post('/api/auth/password-reset', { email: 'maren@example.org' })).status).toBe(202);
  });

  it('keeps "already registered" (409) but limits refused registrations per network address', async () => {
    const prober = await from('203.0.113.10');
    const statuses: number[] = [];
    for (let i = 0; i < 21; i++) {
      statuses.push((await prober.post('/api/auth/register', { name: 'Probe', email: 'volunteer@example.org', password: 'a long enough passphrase' })).status);
    }
    expect(statuses.slice(0, 20).every((s) => s === 409)).toBe(true);
    expect(statuses.at(-1)).toBe(429);
    const someoneElse = await from('198.51.100.32');
    expect((await someoneElse.post('/api/auth/register', { name: 'Again', email: 'volunteer@example.org', password: 'a long enough passphrase' })).status).toBe(409);
  });
});
