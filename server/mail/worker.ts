import { Op } from 'sequelize';
import type { Transporter } from 'nodemailer';
import { MailMessage } from '../db/models/mail-message';

export const MAX_ATTEMPTS = 8;

/** Exponential backoff: 10 s, 20 s, 40 s ... capped at one hour. */
export function backoffMs(attempts: number): number {
  return Math.min(10_000 * 2 ** Math.max(0, attempts - 1), 3_600_000);
}

/**
 * Sends what is due. A failure keeps the message pending with a later attempt time, so an SMTP
 * outage delays mail but loses none; after MAX_ATTEMPTS it is marked failed and kept for a person.
 */
export async function deliverDue(transport: Transporter, from: string, now = new Date(), batch = 20) {
  const due = await MailMessage.findAll({
    where: { status: 'pending', nextAttemptAt: { [Op.lte]: now } },
    order: [['id', 'ASC']],
    limit: batch,
  });
  let sent = 0;
  for (const msg of due) {
    try {
      await transport.sendMail({
        from,
        to: msg.to,
        subject: msg.subject,
        text: msg.text,
        html: msg.html ?? undefined,
        attachments: (msg.attachments ?? []).map((a) => ({ filename: a.filename, contentType: a.contentType, content: a.content })),
      });
      await msg.update({ status: 'sent', sentAt: new Date(), attempts: msg.attempts + 1, lastError: null });
      sent++;
    } catch (err) {
      const attempts = msg.attempts + 1;
      await msg.update({
        attempts,
        lastError: String((err as Error).message ?? err).slice(0, 1000),
        status: attempts >= MAX_ATTEMPTS ? 'failed' : 'pending',
        nextAttemptAt: new Date(now.getTime() + backoffMs(attempts)),
      });
    }
  }
  return { attempted: due.length, sent };
}

export function startOutboxWorker(transport: Transporter, from: string, intervalMs = 2000) {
  let running = false;
  const timer = setInterval(async () => {
    if (running) return;
    running = true;
    try {
      await deliverDue(transport, from);
    } catch (err) {
      console.error('mail outbox:', (err as Error).message);
    } finally {
      running = false;
    }
  }, intervalMs);
  timer.unref();
  return () => clearInterval(timer);
}
