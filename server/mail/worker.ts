import { Op } from 'sequelize';
import type { Transporter } from 'nodemailer';
import { MailMessage } from '../db/models/mail-message';

/** How long the worker keeps trying a message on its own before leaving it to a coordinator. */
export const RETRY_FOR_MS = 7 * 24 * 60 * 60_000;
/** The longest wait between two attempts at one message. */
export const BACKOFF_CAP_MS = 60 * 60_000;
/** The longest the worker waits before asking an unreachable server again: one probe costs one timeout at most. */
export const PROBE_CAP_MS = 5 * 60_000;

/** Exponential backoff: 10 s, 20 s, 40 s ... then hourly, for as long as the message may be retried. */
export function backoffMs(attempts: number): number {
  return Math.min(10_000 * 2 ** Math.max(0, attempts - 1), BACKOFF_CAP_MS);
}

/** Until when a message is retried: its own stamp, or seven days from when it was written. */
export function retryDeadline(msg: Pick<MailMessage, 'retryUntil' | 'createdAt'>): Date {
  return msg.retryUntil ?? new Date(new Date(msg.createdAt).getTime() + RETRY_FOR_MS);
}

interface SmtpError extends Error {
  code?: string;
  command?: string;
  responseCode?: number;
}

const CONNECTION_CODES = new Set(['ECONNECTION', 'ETIMEDOUT', 'ESOCKET', 'EDNS', 'ETLS', 'ECONNREFUSED', 'ECONNRESET']);

/** The server could not be reached or did not answer: nothing about this message was at fault. */
export function isUnreachable(err: SmtpError): boolean {
  return err.command === 'CONN' || (err.code !== undefined && CONNECTION_CODES.has(err.code));
}

/** A 5xx reply is a permanent refusal (RFC 5321, 4.2.1): asking again the same way will not help. */
export function isPermanent(err: SmtpError): boolean {
  return typeof err.responseCode === 'number' && err.responseCode >= 500 && err.responseCode < 600;
}

export interface DeliveryRound {
  attempted: number;
  sent: number;
  /** The round stopped early because the mail server could not be reached. */
  unreachable: boolean;
}

const save = (msg: MailMessage, values: Partial<MailMessage>) =>
  MailMessage.sequelize!.transaction((transaction) => msg.update(values, { transaction }));

/**
 * Sends what is due, oldest first. A failure keeps the message pending with a later attempt time,
 * for up to RETRY_FOR_MS; after that, or at once on a permanent refusal, it is marked failed and
 * kept for a coordinator to send again. When the server cannot be reached at all, the round stops
 * after the first message, rather than waiting out a timeout for every message in the batch.
 */
export async function deliverDue(transport: Transporter, from: string, now = new Date(), batch = 20): Promise<DeliveryRound> {
  const due = await MailMessage.findAll({
    where: { status: 'pending', nextAttemptAt: { [Op.lte]: now } },
    order: [
      ['nextAttemptAt', 'ASC'],
      ['id', 'ASC'],
    ],
    limit: batch,
  });
  const round: DeliveryRound = { attempted: 0, sent: 0, unreachable: false };
  for (const msg of due) {
    // A coordinator may have given it up since the batch was read.
    await msg.reload();
    if (msg.status !== 'pending') continue;
    round.attempted++;
    try {
      await transport.sendMail({
        from,
        to: msg.to,
        subject: msg.subject,
        text: msg.text,
        html: msg.html ?? undefined,
        attachments: (msg.attachments ?? []).map((a) => ({ filename: a.filename, contentType: a.contentType, content: a.content })),
      });
      await save(msg, { status: 'sent', sentAt: now, attempts: msg.attempts + 1, lastError: null });
      round.sent++;
    } catch (e) {
      const err = e as SmtpError;
      const attempts = msg.attempts + 1;
      const next = new Date(now.getTime() + backoffMs(attempts));
      const outOfTime = next.getTime() > retryDeadline(msg).getTime();
      await save(msg, {
        attempts,
        lastError: String(err.message ?? err).slice(0, 1000),
        status: isPermanent(err) || outOfTime ? 'failed' : 'pending',
        nextAttemptAt: next,
      });
      if (isUnreachable(err)) {
        round.unreachable = true;
        break;
      }
    }
  }
  return round;
}

/**
 * Runs delivery rounds on a timer, with a clock that tests can move. While the server is
 * unreachable the worker itself backs off too, up to five minutes (one probe per pause instead of
 * one per tick); the first round that gets through again brings every waiting message forward, so
 * mail held up by an outage goes out within minutes of the server's return, not up to an hour later.
 */
export class OutboxWorker {
  private pausedUntil = 0;
  private downRounds = 0;
  private running = false;

  constructor(
    private readonly transport: Transporter,
    private readonly from: string,
    private readonly clock: () => Date = () => new Date(),
  ) {}

  async tick(): Promise<DeliveryRound | null> {
    const now = this.clock();
    if (this.running || now.getTime() < this.pausedUntil) return null;
    this.running = true;
    try {
      const round = await deliverDue(this.transport, this.from, now);
      if (round.unreachable) {
        this.downRounds++;
        this.pausedUntil = now.getTime() + Math.min(backoffMs(this.downRounds), PROBE_CAP_MS);
      } else if (round.sent > 0 && this.downRounds > 0) {
        this.downRounds = 0;
        await MailMessage.sequelize!.transaction((transaction) =>
          MailMessage.update({ nextAttemptAt: now }, { where: { status: 'pending', nextAttemptAt: { [Op.gt]: now } }, transaction }),
        );
      }
      return round;
    } finally {
      this.running = false;
    }
  }

  start(intervalMs = 2000): () => void {
    const timer = setInterval(() => {
      this.tick().catch((err: unknown) => console.error('mail outbox:', (err as Error).message));
    }, intervalMs);
    timer.unref();
    return () => clearInterval(timer);
  }
}

export function startOutboxWorker(transport: Transporter, from: string, intervalMs = 2000) {
  return new OutboxWorker(transport, from).start(intervalMs);
}
