import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AddressInfo } from 'node:net';
import type { Transporter } from 'nodemailer';
import { makeTestApp, type TestApp } from './test-app';
import { enqueueMail } from '../../server/mail/outbox';
import { deliverDue } from '../../server/mail/worker';
import { catcherCredentials, startMailCatcher } from '../../server/mail/catcher';
import { createTransport } from '../../server/mail/transport';
import { MailMessage } from '../../server/db/models/mail-message';
import { CaughtMail } from '../../server/db/models/caught-mail';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp({ seed: false });
});
afterAll(async () => t.close());

const calendar = ['BEGIN:VCALENDAR', 'VERSION:2.0', 'PRODID:-//Kindloop//test//EN', 'END:VCALENDAR', ''].join('\r\n');

describe('mail attachments', () => {
  it('keeps an attachment in the outbox through a failed attempt and sends it later', async () => {
    await MailMessage.destroy({ where: {} });
    const attachment = { filename: 'drop-off.ics', contentType: 'text/calendar; charset=utf-8; method=REQUEST', content: calendar };
    await enqueueMail({ to: 'maker@example.org', subject: 'Booked', text: 'See you', attachments: [attachment] });
    const failing = { sendMail: async () => Promise.reject(new Error('connection refused')) } as unknown as Transporter;
    await deliverDue(failing, 'f@example.org');
    const sent: unknown[] = [];
    const working = { sendMail: async (m: { attachments: unknown[] }) => void sent.push(m.attachments) } as unknown as Transporter;
    await deliverDue(working, 'f@example.org', new Date(Date.now() + 3_600_000));
    expect(sent).toEqual([[attachment]]);
  });

  it('stores no attachment column value for a plain message', async () => {
    await MailMessage.destroy({ where: {} });
    const msg = await enqueueMail({ to: 'x@example.org', subject: 'Plain', text: 'T' });
    await msg.reload();
    expect(msg.attachments).toBeNull();
  });

  it('carries a calendar attachment through nodemailer to the catcher, byte for byte', async () => {
    const credentials = catcherCredentials();
    const server = await startMailCatcher(0, { sender: 'Kindloop <no-reply@example.org>', credentials });
    const port = (server.server.address() as AddressInfo).port;
    try {
      await MailMessage.destroy({ where: {} });
      await enqueueMail({
        to: 'maker@example.org',
        subject: 'Drop-off booked',
        text: 'The invitation is attached.',
        attachments: [{ filename: 'drop-off.ics', contentType: 'text/calendar; charset=utf-8; method=REQUEST', content: calendar }],
      });
      expect((await deliverDue(createTransport(undefined, { port, credentials }), 'Kindloop <no-reply@example.org>')).sent).toBe(1);
      const caught = await CaughtMail.findOne({ where: { subject: 'Drop-off booked' } });
      expect(caught?.attachments).toHaveLength(1);
      expect(caught?.attachments?.[0]).toMatchObject({ filename: 'drop-off.ics', content: calendar });
      expect(caught?.attachments?.[0].contentType).toBe('text/calendar');
    } finally {
      await new Promise<void>((r) => server.close(() => r()));
    }
  });
});
