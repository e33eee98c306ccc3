import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import net, { type AddressInfo } from 'node:net';
import nodemailer, { type Transporter } from 'nodemailer';
import { makeTestApp, type TestApp } from './test-app';
import { enqueueMail } from '../../server/mail/outbox';
import { BACKOFF_CAP_MS, backoffMs, deliverDue, OutboxWorker, PROBE_CAP_MS, RETRY_FOR_MS } from '../../server/mail/worker';
import { catcherCredentials, startMailCatcher, type CatcherCredentials } from '../../server/mail/catcher';
import { createTransport, SMTP_TIMEOUTS } from '../../server/mail/transport';
import { MailMessage } from '../../server/db/models/mail-message';
import { CaughtMail } from '../../server/db/models/caught-mail';
import { User } from '../../server/db/models/user';

const SENDER = 'Kindloop <no-reply@example.org>';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp({ seed: false });
});
afterAll(async () => t.close());

const failing = { sendMail: async () => Promise.reject(new Error('connection refused')) } as unknown as Transporter;
const refusedFor = (responseCode: number) =>
  ({ sendMail: async () => Promise.reject(Object.assign(new Error(`${responseCode} no`), { responseCode })) }) as unknown as Transporter;
const minutes = (n: number) => n * 60_000;

async function catcherOn(port: number, credentials: CatcherCredentials) {
  const server = await startMailCatcher(port, { sender: SENDER, credentials });
  return { server, port: (server.server.address() as AddressInfo).port, close: () => new Promise<void>((r) => server.close(() => r())) };
}

describe('mail outbox', () => {
  it('keeps a message when SMTP is down and sends it once SMTP is back', async () => {
    await MailMessage.destroy({ where: {} });
    const msg = await enqueueMail({ to: 'someone@example.org', subject: 'Hello', text: 'Body' });
    const now = new Date();
    expect(await deliverDue(failing, 'from@example.org', now)).toMatchObject({ attempted: 1, sent: 0 });
    await msg.reload();
    expect(msg.status).toBe('pending');
    expect(msg.attempts).toBe(1);
    expect(msg.lastError).toMatch(/refused/);
    expect(msg.nextAttemptAt.getTime()).toBe(now.getTime() + backoffMs(1));
    // Not due yet: nothing is attempted.
    expect((await deliverDue(failing, 'from@example.org', now)).attempted).toBe(0);

    const sent: string[] = [];
    const working = { sendMail: async (m: { to: string }) => void sent.push(m.to) } as unknown as Transporter;
    expect(await deliverDue(working, 'from@example.org', new Date(now.getTime() + backoffMs(1)))).toMatchObject({ attempted: 1, sent: 1 });
    await msg.reload();
    expect(msg.status).toBe('sent');
    expect(sent).toEqual(['someone@example.org']);
  });

  it('backs off exponentially up to an hour', () => {
    expect([1, 2, 3].map(backoffMs)).toEqual([10_000, 20_000, 40_000]);
    expect(backoffMs(30)).toBe(BACKOFF_CAP_MS);
    expect(BACKOFF_CAP_MS).toBe(minutes(60));
  });

  it('keeps trying at most an hour apart for seven days, then leaves the message failed for a person', async () => {
    await MailMessage.destroy({ where: {} });
    const msg = await enqueueMail({ to: 'x@example.org', subject: 'S', text: 'T' });
    const start = msg.createdAt.getTime();
    let when = new Date(start);
    const gaps: number[] = [];
    for (let i = 0; i < 1000 && msg.status === 'pending'; i++) {
      await deliverDue(failing, 'f@example.org', when);
      await msg.reload();
      gaps.push(msg.nextAttemptAt.getTime() - when.getTime());
      when = msg.nextAttemptAt;
    }
    expect(msg.status).toBe('failed');
    expect(Math.max(...gaps)).toBe(BACKOFF_CAP_MS);
    // The old worker stopped after 8 attempts (about 21 minutes); now the last try is in the seventh day.
    expect(msg.attempts).toBeGreaterThan(7 * 24);
    expect(msg.nextAttemptAt.getTime() - start).toBeGreaterThan(RETRY_FOR_MS);
    expect(msg.nextAttemptAt.getTime() - start).toBeLessThanOrEqual(RETRY_FOR_MS + BACKOFF_CAP_MS);
  });

  it('marks a permanent refusal (5xx) failed at once, and retries a temporary one (4xx)', async () => {
    await MailMessage.destroy({ where: {} });
    const a = await enqueueMail({ to: 'gone@example.org', subject: 'A', text: 'T' });
    await deliverDue(refusedFor(550), SENDER, new Date());
    expect((await a.reload()).status).toBe('failed');
    const b = await enqueueMail({ to: 'busy@example.org', subject: 'B', text: 'T' });
    await deliverDue(refusedFor(451), SENDER, new Date());
    expect((await b.reload()).status).toBe('pending');
  });

  it('writes nothing when the change that causes the mail rolls back', async () => {
    await MailMessage.destroy({ where: {} });
    await expect(
      t.sequelize.transaction(async (transaction) => {
        await enqueueMail({ to: 'y@example.org', subject: 'S', text: 'T' }, transaction);
        await User.create({ name: 'x', email: 'dup@example.org', passwordHash: 'x' }, { transaction });
        await User.create({ name: 'y', email: 'dup@example.org', passwordHash: 'x' }, { transaction });
      }),
    ).rejects.toThrow();
    expect(await MailMessage.count()).toBe(0);
  });

  it('delivers through nodemailer to the local catcher, which stores the parsed message', async () => {
    const credentials = catcherCredentials();
    const c = await catcherOn(0, credentials);
    try {
      await MailMessage.destroy({ where: {} });
      await enqueueMail({ to: 'maker@example.org', subject: 'Your blanket KL-ABCD', text: 'It arrived safely.' });
      const res = await deliverDue(createTransport(undefined, { port: c.port, credentials }), SENDER);
      expect(res.sent).toBe(1);
      const caught = await CaughtMail.findOne({ where: { subject: 'Your blanket KL-ABCD' } });
      expect(caught?.to).toBe('maker@example.org');
      expect(caught?.text.trim()).toBe('It arrived safely.');
    } finally {
      await c.close();
    }
  });
});

describe('an SMTP outage longer than the old 21-minute limit', () => {
  it('sends every message exactly once when the server returns after three hours', async () => {
    await MailMessage.destroy({ where: {} });
    await CaughtMail.destroy({ where: {} });
    const credentials = catcherCredentials();
    // Take a free port, then close the server on it: connections are refused, as in an outage.
    const first = await catcherOn(0, credentials);
    const port = first.port;
    await first.close();

    let now = Date.now();
    const worker = new OutboxWorker(createTransport(undefined, { port, credentials }), SENDER, () => new Date(now));
    const subjects: string[] = [];
    const enqueue = async (i: number) => {
      subjects.push(`Outage message ${i}`);
      await enqueueMail({ to: `maker${i}@example.org`, subject: `Outage message ${i}`, text: `Number ${i}` });
    };
    for (let i = 0; i < 12; i++) await enqueue(i);
    // Three hours down, the clock moved a minute per tick; more mail is written during the outage.
    for (let minute = 0; minute < 180; minute++) {
      if (minute === 30 || minute === 90) for (let i = 0; i < 4; i++) await enqueue(subjects.length);
      await worker.tick();
      now += minutes(1);
    }
    expect(await CaughtMail.count()).toBe(0);
    const during = await MailMessage.findAll();
    expect(during.every((m) => m.status === 'pending')).toBe(true);
    expect(Math.max(...during.map((m) => m.attempts))).toBeGreaterThan(0);

    const back = await catcherOn(port, credentials);
    try {
      const returnedAt = now;
      for (let i = 0; i < 400 && (await MailMessage.count({ where: { status: 'pending' } })) > 0; i++) {
        await worker.tick();
        now += 5000;
      }
      const after = await MailMessage.findAll();
      expect(after.map((m) => m.status)).toEqual(after.map(() => 'sent'));
      // It all went out within the worker's longest pause after the server came back, not an hour later.
      const lastSent = Math.max(...after.map((m) => m.sentAt!.getTime()));
      expect(lastSent - returnedAt).toBeLessThanOrEqual(PROBE_CAP_MS + minutes(1));
      const caught = await CaughtMail.findAll();
      const counts = new Map<string, number>();
      for (const c of caught) counts.set(c.subject, (counts.get(c.subject) ?? 0) + 1);
      expect([...counts.keys()].sort()).toEqual([...subjects].sort());
      expect([...counts.values()].every((n) => n === 1)).toBe(true);
    } finally {
      await back.close();
    }
  });

  it('gives up on a silent server after the greeting timeout and stops the round there', async () => {
    await MailMessage.destroy({ where: {} });
    const sockets: net.Socket[] = [];
    const silent = net.createServer((s) => void sockets.push(s));
    await new Promise<void>((r) => silent.listen(0, '127.0.0.1', () => r()));
    const port = (silent.address() as AddressInfo).port;
    try {
      for (let i = 0; i < 3; i++) await enqueueMail({ to: `m${i}@example.org`, subject: `S${i}`, text: 'T' });
      const transport = createTransport(undefined, { port, credentials: catcherCredentials() }, { ...SMTP_TIMEOUTS, greetingTimeout: 150 });
      const round = await deliverDue(transport, SENDER, new Date());
      expect(round).toEqual({ attempted: 1, sent: 0, unreachable: true });
      const tried = await MailMessage.findAll({ where: { attempts: 1 } });
      expect(tried).toHaveLength(1);
      expect(tried[0]!.lastError).toMatch(/greeting/i);
    } finally {
      for (const s of sockets) s.destroy();
      await new Promise<void>((r) => silent.close(() => r()));
    }
  });

  it('sets connection, greeting and socket timeouts on both kinds of transport', () => {
    for (const transport of [
      createTransport('smtp://mail.example.org:587', { port: 2525, credentials: catcherCredentials() }),
      createTransport(undefined, { port: 2525, credentials: catcherCredentials() }),
    ]) {
      const options = (transport as unknown as { options: Record<string, unknown> }).options;
      expect(options).toMatchObject({ connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 30_000 });
    }
  });
});

describe('the local mail catcher', () => {
  const attempt = (port: number, opts: { from: string; auth?: { user: string; pass: string } }) =>
    nodemailer
      .createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true, auth: opts.auth })
      .sendMail({ from: opts.from, to: 'maker@example.org', subject: 'Planted', text: 'Click http://evil.example.org/' });

  it('takes mail only from Kindloop: its own credentials and its own sender address', async () => {
    const credentials = catcherCredentials();
    const c = await catcherOn(0, credentials);
    try {
      await CaughtMail.destroy({ where: {} });
      await expect(attempt(c.port, { from: SENDER })).rejects.toThrow();
      await expect(attempt(c.port, { from: SENDER, auth: { user: credentials.user, pass: 'guessed' } })).rejects.toThrow(/535/);
      await expect(attempt(c.port, { from: 'someone@example.org', auth: credentials })).rejects.toThrow(/553/);
      expect(await CaughtMail.count()).toBe(0);
      await attempt(c.port, { from: SENDER, auth: credentials });
      expect(await CaughtMail.count()).toBe(1);
    } finally {
      await c.close();
    }
  });
});
