// nodemailer over SMTP. Short timeouts: the outbox worker retries later, so
// a mail server that hangs must not hold a worker for minutes.
import nodemailer, { type Transporter } from 'nodemailer';

export function createMailTransport(smtpUrl: string): Transporter {
  const url = new URL(smtpUrl);
  const local = url.hostname === '127.0.0.1' || url.hostname === 'localhost' || url.hostname === '::1';
  return nodemailer.createTransport({
    url: smtpUrl,
    // The loopback fake offers no TLS; a real server is asked for STARTTLS as usual.
    ignoreTLS: local && url.protocol === 'smtp:',
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 30_000,
  } as Parameters<typeof nodemailer.createTransport>[0]);
}
