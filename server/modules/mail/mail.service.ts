import type { Sequelize } from 'sequelize';
import { Op, type WhereOptions } from 'sequelize';
import { CaughtMail } from '../../db/models/caught-mail';
import { MailMessage } from '../../db/models/mail-message';
import { HttpError, notFound } from '../../lib/http-error';
import { RETRY_FOR_MS, retryDeadline } from '../../mail/worker';
import { isSoleAddressee, redactSingleUseLinks } from '../../mail/redact';
import type { MailAttachment } from '../../mail/attachment';
import type { Page } from '@shared/schemas/page';
import type { OutboxCounts, OutboxItem, OutboxQuery } from '@shared/schemas/mail';

export interface CaughtMailView {
  id: number;
  from: string;
  to: string;
  subject: string;
  text: string;
  attachments: MailAttachment[] | null;
  receivedAt: string;
  /** How many single-use links were taken out because the reader is not the addressee. */
  linksHidden: number;
}

export function caughtView(m: CaughtMail, readerEmail: string): CaughtMailView {
  const own = isSoleAddressee(m.to, readerEmail);
  const redact = (t: string) => (own ? { text: t, hidden: 0 } : redactSingleUseLinks(t));
  const body = redact(m.text);
  let hidden = body.hidden;
  // An attachment (a calendar invitation) is text the same way, and is read the same way.
  const attachments =
    m.attachments?.map((a) => {
      const r = redact(a.content);
      hidden += r.hidden;
      return { ...a, content: r.text };
    }) ?? null;
  return {
    id: m.id,
    from: m.from,
    to: m.to,
    subject: m.subject,
    text: body.text,
    attachments,
    receivedAt: new Date(m.receivedAt).toISOString(),
    linksHidden: hidden,
  };
}

export async function listCaught(readerEmail: string, q: { page: number; pageSize: number }): Promise<Page<CaughtMailView>> {
  const { rows, count } = await CaughtMail.findAndCountAll({
    order: [['id', 'DESC']],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  return { items: rows.map((m) => caughtView(m, readerEmail)), total: count, page: q.page, pageSize: q.pageSize };
}

export async function getCaught(readerEmail: string, id: number): Promise<CaughtMailView> {
  const m = await CaughtMail.findByPk(id);
  if (!m) throw notFound('That message');
  return caughtView(m, readerEmail);
}

export async function outboxCounts(): Promise<OutboxCounts> {
  const rows = (await MailMessage.count({ group: ['status'] })) as unknown as Array<{ status: string; count: number }>;
  const n = (s: string) => rows.find((r) => r.status === s)?.count ?? 0;
  return { pending: n('pending'), sent: n('sent'), failed: n('failed'), givenUp: n('given-up') };
}

/** Never the body: an outbox row may hold someone's reset link. */
export function outboxItem(m: MailMessage): OutboxItem {
  return {
    id: m.id,
    to: m.to,
    subject: m.subject,
    status: m.status,
    attempts: m.attempts,
    lastError: m.lastError ?? null,
    nextAttemptAt: new Date(m.nextAttemptAt).toISOString(),
    retryUntil: retryDeadline(m).toISOString(),
    givenUpAt: m.givenUpAt ? new Date(m.givenUpAt).toISOString() : null,
    createdAt: new Date(m.createdAt).toISOString(),
  };
}

export async function listOutbox(q: OutboxQuery): Promise<Page<OutboxItem>> {
  const where: WhereOptions<MailMessage> =
    q.show === 'unsent' ? { status: { [Op.in]: ['pending', 'failed'] } } : { status: q.show };
  const { rows, count } = await MailMessage.findAndCountAll({
    where,
    // Failed first (they need a person), then the oldest waiting.
    order: [
      ['status', 'ASC'],
      ['createdAt', q.dir === 'desc' ? 'DESC' : 'ASC'],
      ['id', 'ASC'],
    ],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  return { items: rows.map(outboxItem), total: count, page: q.page, pageSize: q.pageSize };
}

/**
 * Puts a message back in the queue for the next round, with a fresh week of retries. A message
 * already sent is not sent twice; that is a conflict, not a retry.
 */
export async function sendAgain(sequelize: Sequelize, id: number, now = new Date()): Promise<OutboxItem> {
  return sequelize.transaction(async (transaction) => {
    const m = await MailMessage.findByPk(id, { transaction });
    if (!m) throw notFound('That message');
    if (m.status === 'sent') throw new HttpError(409, 'That message was already sent; it is not sent twice');
    await m.update(
      { status: 'pending', nextAttemptAt: now, retryUntil: new Date(now.getTime() + RETRY_FOR_MS), givenUpAt: null },
      { transaction },
    );
    return outboxItem(m);
  });
}

/** Stops a message that is waiting or failed; it stays listed and can be sent again later. */
export async function giveUp(sequelize: Sequelize, id: number, now = new Date()): Promise<OutboxItem> {
  return sequelize.transaction(async (transaction) => {
    const m = await MailMessage.findByPk(id, { transaction });
    if (!m) throw notFound('That message');
    if (m.status === 'sent') throw new HttpError(409, 'That message was already sent, so there is nothing to give up');
    if (m.status !== 'given-up') await m.update({ status: 'given-up', givenUpAt: now }, { transaction });
    return outboxItem(m);
  });
}
