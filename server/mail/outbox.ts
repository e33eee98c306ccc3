import type { Transaction } from 'sequelize';
import { MailMessage } from '../db/models/mail-message';
import { RETRY_FOR_MS } from './worker';
import type { MailAttachment } from './attachment';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: MailAttachment[];
}

/** Write a message into the outbox inside the caller's transaction: it is sent only if the change commits. */
export async function enqueueMail(mail: OutgoingMail, transaction?: Transaction) {
  const now = new Date();
  return MailMessage.create(
    {
      to: mail.to,
      subject: mail.subject,
      text: mail.text,
      html: mail.html ?? null,
      nextAttemptAt: now,
      attachments: mail.attachments?.length ? mail.attachments : null,
      retryUntil: new Date(now.getTime() + RETRY_FOR_MS),
    },
    { transaction },
  );
}
