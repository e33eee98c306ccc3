import nodemailer, { type Transporter } from 'nodemailer';

/** SMTP_URL when set; otherwise the built-in catcher on loopback. */
export function createTransport(smtpUrl: string | undefined, catcherPort: number): Transporter {
  if (smtpUrl) return nodemailer.createTransport(smtpUrl);
  return nodemailer.createTransport({
    host: '127.0.0.1',
    port: catcherPort,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 5000,
    greetingTimeout: 5000,
  });
}
