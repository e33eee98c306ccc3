import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import { CaughtMail } from '../db/models/caught-mail';

function addresses(a: AddressObject | AddressObject[] | undefined): string {
  if (!a) return '';
  return (Array.isArray(a) ? a : [a]).map((x) => x.text).join(', ');
}

/** A local SMTP sink on loopback: every message the outbox sends lands in caught_mail for the mail page. */
export function startMailCatcher(port: number): Promise<SMTPServer> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: 5 * 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((parsed) =>
          CaughtMail.create({
            from: addresses(parsed.from),
            to: addresses(parsed.to),
            subject: parsed.subject ?? '(no subject)',
            text: parsed.text ?? '',
            // Text attachments (calendar invitations) are kept whole so the mail page can offer them.
            attachments: parsed.attachments.length
              ? parsed.attachments.map((a) => ({
                  filename: a.filename ?? 'attachment',
                  contentType: a.contentType,
                  content: a.contentType.startsWith('text/') ? a.content.toString('utf8') : '',
                }))
              : null,
          }),
        )
        .then(() => callback(), (err: Error) => callback(err));
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve(server));
  });
}
