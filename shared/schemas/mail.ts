import { z } from 'zod';
import { PageQuerySchema } from './page-query';

/**
 * pending: the worker will try it (again) at nextAttemptAt. sent: handed to the mail server.
 * failed: refused for good by the mail server, or still unsent when its days of retrying ran out.
 * given-up: a coordinator stopped it. Failed and given-up messages can be sent again.
 */
export const MAIL_STATUSES = ['pending', 'sent', 'failed', 'given-up'] as const;
export type MailStatus = (typeof MAIL_STATUSES)[number];

/** Which outbox messages to list: by default everything not yet sent. */
export const OUTBOX_SHOWS = ['unsent', 'pending', 'failed', 'given-up'] as const;
export type OutboxShow = (typeof OUTBOX_SHOWS)[number];

export const OutboxQuerySchema = PageQuerySchema.extend({
  show: z.enum(OUTBOX_SHOWS, { error: `show is one of ${OUTBOX_SHOWS.join(', ')}` }).default('unsent'),
});
export type OutboxQuery = z.infer<typeof OutboxQuerySchema>;

/** An outbox message as coordinators see it: never its body, which may hold someone's reset link. */
export interface OutboxItem {
  id: number;
  to: string;
  subject: string;
  status: MailStatus;
  attempts: number;
  lastError: string | null;
  nextAttemptAt: string;
  retryUntil: string;
  givenUpAt: string | null;
  createdAt: string;
}

export interface OutboxCounts {
  pending: number;
  sent: number;
  failed: number;
  givenUp: number;
}
