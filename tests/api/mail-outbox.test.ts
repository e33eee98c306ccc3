import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AddressInfo } from 'node:net';
import type { Transporter } from 'nodemailer';
import { makeTestApp, type TestApp } from './test-app';
import { enqueueMail } from '../../server/mail/outbox';
import { backoffMs, deliverDue, MAX_ATTEMPTS } from '../../server/mail/worker';
import { startMailCatcher } from '../../server/mail/catcher';
import { createTransport } from '../../server/mail/transport';
import { MailMessage } from '../../server/db/models/mail-message';
import { CaughtMail } from '../../server/db/models/caught-mail';
import { User } from '../../server/db/models/user';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp({ seed: false });
});
afterAll(async () => t.close());

const failing = { sendMail: async () => Promise.reject(new Error('connection refused')) } as unknown as Transporter;

describe('mail outbox', () => {
  it('keeps a message when SMTP is down and sends it once SMTP is back', async () => {
    await MailMessage.destroy({ where: {} });
    const msg = await enqueueMail({ to: 'someone@example.org', subject: 'Hello', text: 'Body' });
    const now = new Date();
    expect(await deliverDue(failing, 'from@example.org', now)).toEqual({ attempted: 1, sent: 0 });
    await msg.reload();
    expect(msg.status).toBe('pending');
    expect(msg.attempts).toBe(1);
    expect(msg.lastError).toMatch(/refused/);
    expect(msg.nextAttemptAt.getTime()).toBe(now.getTime() + backoffMs(1));
    // Not due yet: nothing is attempted.
    expect((await deliverDue(failing, 'from@example.org', now)).attempted).toBe(0);

    const sent: string[] = [];
    const working = { sendMail: async (m: { to: string }) => void sent.push(m.to) } as unknown as Transporter;
    expect(await deliverDue(working, 'from@example.org', new Date(now.getTime() + backoffMs(1)))).toEqual({ attempted: 1, sent: 1 });
    await msg.reload();
    expect(msg.status).toBe('sent');
    expect(sent).toEqual(['someone@example.org']);
  });

  it('marks a message failed after the last attempt, and keeps it', async () => {
    await MailMessage.destroy({ where: {} });
    const msg = await enqueueMail({ to: 'x@example.org', subject: 'S', text: 'T' });
    let when = new Date();
    for (let i = 0; i < MAX_ATTEMPTS; i++) {
      await deliverDue(failing, 'f@example.org', when);
      when = new Date(when.getTime() + backoffMs(i + 1));
    }
    await msg.reload();
    expect(msg.status).toBe('failed');
    expect(msg.attempts).toBe(MAX_ATTEMPTS);
  });

  it('backs off exponentially up to an hour', () => {
    expect([1, 2, 3].map(backoffMs)).toEqual([10_000, 20_000, 40_000]);
    expect(backoffMs(30)).toBe(3_600_000);
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
    const server = await startMailCatcher(0);
    const port = (server.server.address() as AddressInfo).port;
    try {
      await MailMessage.destroy({ where: {} });
      await enqueueMail({ to: 'maker@example.org', subject: 'Your blanket KL-ABCD', text: 'It arrived safely.' });
      const res = await deliverDue(createTransport(undefined, port), 'Kindloop <no-reply@example.org>');
      expect(res.sent).toBe(1);
      const caught = await CaughtMail.findOne({ where: { subject: 'Your blanket KL-ABCD' } });
      expect(caught?.to).toBe('maker@example.org');
      expect(caught?.text.trim()).toBe('It arrived safely.');
    } finally {
      await new Promise<void>((r) => server.close(() => r()));
    }
  });
});
