import { MailMessage } from '../models/mail-message';
import { loadConfig } from '../../config/env';
import { welcomeMail } from '../../mail/templates';
import { RETRY_FOR_MS } from '../../mail/worker';
import { addSeedStep } from './demo';
import { daysFrom } from './seed-context';

/**
 * One message the (fictional) mail server refused for good, so a coordinator finds the Mail page's
 * "Not sent yet" list with something in it and can try "Send again".
 */
addSeedStep(async ({ transaction, today, users }) => {
  const felix = users.volunteers.find((u) => u.email === 'felix@example.org');
  if (!felix) return;
  const written = daysFrom(today, -2);
  await MailMessage.create(
    {
      to: felix.email,
      // The seed does not know the server's address; the default one stands in, as on a fresh install.
      ...welcomeMail(felix.name, loadConfig({}).publicUrl),
      status: 'failed',
      attempts: 1,
      lastError: '550 5.1.1 Mailbox unavailable: felix@example.org',
      nextAttemptAt: written,
      retryUntil: new Date(written.getTime() + RETRY_FOR_MS),
      createdAt: written,
    },
    { transaction },
  );
});
