import { randomBytes, timingSafeEqual } from 'node:crypto';
import { SMTPServer } from 'smtp-server';
import type { AddressObject } from 'mailparser';
import { CaughtMail } from '../db/models/caught-mail';
import { addressesIn } from './redact';

function addresses(a: AddressObject | AddressObject[] | undefined): string {
  if (!a) return '';
  return (Array.isArray(a) ? a : [a]).map((x) => x.text).join(', ');
}

/** The catcher's sign-in: made fresh at each start and known only to this process's transport. */
export interface CatcherCredentials {
  user: string;
  pass: string;
}
export const catcherCredentials = (): CatcherCredentials => ({ user: 'kindloop', pass: randomBytes(24).toString('base64url') });

const refuse = (message: string, responseCode: number) => Object.assign(new Error(message), { responseCode });
const same = (a: string, b: string) => a.length === b.length && timingSafeEqual(Buffer.from(a), Buffer.from(b));

/**
 * A local SMTP sink on loopback: every message the outbox sends lands in caught_mail for the mail
 * page. Other programs on the machine can reach a loopback port too, so it takes mail only from a
 * client that signs in with this start's credentials and only from the app's own sender address;
 * anything else could plant messages (and links) on the coordinators' Mail page.
 */
export function startMailCatcher(port: number, opts: { sender: string; credentials: CatcherCredentials }): Promise<SMTPServer> {
  const sender = addressesIn(opts.sender)[0] ?? '';
  const server = new SMTPServer({
    authOptional: false,
    // Loopback only, so the credentials never cross a network in clear.
    allowInsecureAuth: true,
    authMethods: ['PLAIN', 'LOGIN'],
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 5 * 1024 * 1024,
    onAuth(auth, _session, callback) {
      if (auth.username === opts.credentials.user && same(auth.password ?? '', opts.credentials.pass)) {
        return callback(null, { user: auth.username });
      }
      return callback(refuse('This mail catcher takes mail only from Kindloop itself', 535));
    },
    onMailFrom(address, _session, callback) {
      if (address.address.trim().toLowerCase() === sender) return callback();
      return callback(refuse(`Only ${sender} may send through this mail catcher`, 553));
    },
    onData(stream, _session, callback) {
      // mailparser is loaded with the first message caught, not at every start.
      import('mailparser')
        .then(({ simpleParser }) => simpleParser(stream))
        .then((parsed) => {
          const from = addresses(parsed.from);
          if (addressesIn(from)[0] !== sender) throw refuse(`Only ${sender} may send through this mail catcher`, 553);
          return CaughtMail.create({
            from,
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
          });
        })
        .then(() => callback(), (err: Error) => callback(err));
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve(server));
  });
}
