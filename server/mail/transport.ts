import nodemailer, { type Transporter } from 'nodemailer';
import type { CatcherCredentials } from './catcher';

/**
 * How long to wait for a mail server before calling it unreachable. nodemailer's own defaults are
 * 2 minutes to connect, 30 s for the greeting and 10 minutes of socket silence, so one server that
 * accepts connections and never answers held up each message for half a minute or more.
 */
export const SMTP_TIMEOUTS = { connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 30_000, dnsTimeout: 10_000 };
export type SmtpTimeouts = typeof SMTP_TIMEOUTS;

/** SMTP_URL when set; otherwise the built-in catcher on loopback, signed in with its credentials. */
export function createTransport(
  smtpUrl: string | undefined,
  catcher: { port: number; credentials: CatcherCredentials },
  timeouts: SmtpTimeouts = SMTP_TIMEOUTS,
): Transporter {
  // Settings given in the URL's query (?greetingTimeout=...) still win over these.
  if (smtpUrl) return nodemailer.createTransport({ url: smtpUrl, ...timeouts });
  return nodemailer.createTransport({
    host: '127.0.0.1',
    port: catcher.port,
    secure: false,
    ignoreTLS: true,
    auth: { user: catcher.credentials.user, pass: catcher.credentials.pass },
    ...timeouts,
  });
}
