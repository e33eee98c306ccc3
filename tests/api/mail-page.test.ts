import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { enqueueMail } from '../../server/mail/outbox';
import { MailMessage } from '../../server/db/models/mail-message';
import { CaughtMail } from '../../server/db/models/caught-mail';
import { HIDDEN_LINK } from '../../server/mail/redact';
import { passwordResetMail } from '../../server/mail/templates';

let t: TestApp;
let coordinator: Client;
beforeAll(async () => {
  t = await makeTestApp();
  coordinator = await signedIn(t.app, 'coordinator');
});
afterAll(async () => t.close());

describe('single-use links on the Mail page', () => {
  const link = (token: string) => `http://127.0.0.1:3000/reset-password?token=${token}`;

  it("hides a reset link in someone else's mail, and says so", async () => {
    const m = await CaughtMail.create({ from: 'Kindloop <no-reply@example.org>', to: 'maren@example.org', ...passwordResetMail('Maren', link('A'.repeat(43)), 60) });
    const list = await coordinator.get('/api/mail/caught');
    expect(list.status).toBe(200);
    const shown = list.body.mail.items.find((x: { id: number }) => x.id === m.id);
    expect(shown.text).not.toContain('token=');
    expect(shown.text).toContain(HIDDEN_LINK);
    expect(shown.linksHidden).toBe(1);
    const one = await coordinator.get(`/api/mail/caught/${m.id}`);
    expect(one.body.mail.text).not.toContain('A'.repeat(43));
    expect(one.body.mail.linksHidden).toBe(1);
  });

  it('shows the link to its addressee, the coordinator reading their own mail', async () => {
    const m = await CaughtMail.create({ from: 'Kindloop <no-reply@example.org>', to: 'coordinator@example.org', ...passwordResetMail('Cora', link('B'.repeat(43)), 60) });
    const one = await coordinator.get(`/api/mail/caught/${m.id}`);
    expect(one.body.mail.text).toContain(link('B'.repeat(43)));
    expect(one.body.mail.linksHidden).toBe(0);
  });

  it('hides it when the mail went to several people, even if the reader is one of them', async () => {
    const m = await CaughtMail.create({ from: 'k', to: 'coordinator@example.org, maren@example.org', subject: 'S', text: `Go to ${link('C'.repeat(43))} now` });
    const one = await coordinator.get(`/api/mail/caught/${m.id}`);
    expect(one.body.mail.text).toBe(`Go to ${HIDDEN_LINK} now`);
  });

  it('leaves ordinary links alone', async () => {
    const m = await CaughtMail.create({ from: 'k', to: 'maren@example.org', subject: 'Welcome', text: 'See http://127.0.0.1:3000/needs for what is needed' });
    expect((await coordinator.get(`/api/mail/caught/${m.id}`)).body.mail.text).toContain('http://127.0.0.1:3000/needs');
  });

  it('pages the kept mail on the server', async () => {
    const res = await coordinator.get('/api/mail/caught?page=1&pageSize=2');
    expect(res.body.mail.items).toHaveLength(2);
    expect(res.body.mail.total).toBe(await CaughtMail.count());
    expect((await coordinator.get('/api/mail/caught?pageSize=500')).status).toBe(400);
  });
});

describe('the outbox on the Mail page', () => {
  it('lists waiting and failed messages without their bodies, failed first', async () => {
    await MailMessage.destroy({ where: {} });
    const waiting = await enqueueMail({ to: 'a@example.org', subject: 'Waiting one', text: 'secret body http://x/reset-password?token=zzz' });
    const failed = await enqueueMail({ to: 'b@example.org', subject: 'Failed one', text: 'T' });
    await failed.update({ status: 'failed', attempts: 9, lastError: '550 mailbox unavailable' });
    const sent = await enqueueMail({ to: 'c@example.org', subject: 'Sent one', text: 'T' });
    await sent.update({ status: 'sent', sentAt: new Date() });

    const res = await coordinator.get('/api/mail/outbox');
    expect(res.status).toBe(200);
    expect(res.body.messages.items.map((m: { id: number }) => m.id)).toEqual([failed.id, waiting.id]);
    expect(res.body.messages.total).toBe(2);
    expect(JSON.stringify(res.body)).not.toContain('secret body');
    expect(res.body.counts).toEqual({ pending: 1, sent: 1, failed: 1, givenUp: 0 });
    expect(res.body.messages.items[0]).toMatchObject({ status: 'failed', attempts: 9, lastError: '550 mailbox unavailable' });
    expect((await coordinator.get('/api/mail/outbox?show=nonsense')).status).toBe(400);
  });

  it('sends a failed message again with a fresh week, and gives one up', async () => {
    const failed = (await MailMessage.findOne({ where: { status: 'failed' } }))!;
    const again = await coordinator.post(`/api/mail/outbox/${failed.id}/send-again`);
    expect(again.status).toBe(200);
    expect(again.body.message.status).toBe('pending');
    await failed.reload();
    expect(failed.status).toBe('pending');
    expect(failed.nextAttemptAt.getTime()).toBeLessThanOrEqual(Date.now());
    expect(failed.retryUntil!.getTime() - Date.now()).toBeGreaterThan(6.9 * 24 * 3600_000);

    const stop = await coordinator.post(`/api/mail/outbox/${failed.id}/give-up`);
    expect(stop.status).toBe(200);
    await failed.reload();
    expect(failed.status).toBe('given-up');
    expect(failed.givenUpAt).toBeTruthy();
    const listed = await coordinator.get('/api/mail/outbox?show=given-up');
    expect(listed.body.messages.items.map((m: { id: number }) => m.id)).toEqual([failed.id]);
    // And back again.
    expect((await coordinator.post(`/api/mail/outbox/${failed.id}/send-again`)).body.message.status).toBe('pending');
  });

  it('refuses to send twice or give up what was sent (409), and answers 404 for no such message', async () => {
    const sent = (await MailMessage.findOne({ where: { status: 'sent' } }))!;
    const twice = await coordinator.post(`/api/mail/outbox/${sent.id}/send-again`);
    expect(twice.status).toBe(409);
    expect(twice.body.error.message).toMatch(/already sent/);
    expect((await coordinator.post(`/api/mail/outbox/${sent.id}/give-up`)).status).toBe(409);
    expect((await coordinator.post('/api/mail/outbox/999999/send-again')).status).toBe(404);
    await sent.reload();
    expect(sent.status).toBe('sent');
  });

  it('twenty coordinators pressing "send again" at once leave one pending message, never a 5xx', async () => {
    const m = await enqueueMail({ to: 'race@example.org', subject: 'Race', text: 'T' });
    await m.update({ status: 'failed' });
    const results = await Promise.all(Array.from({ length: 20 }, () => coordinator.post(`/api/mail/outbox/${m.id}/send-again`)));
    expect(results.every((r) => r.status === 200)).toBe(true);
    expect(await MailMessage.count({ where: { to: 'race@example.org' } })).toBe(1);
    expect((await m.reload()).status).toBe('pending');
  });
});
