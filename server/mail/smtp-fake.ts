// The local SMTP fake used when no SMTP_URL is configured (and by tests): a
// real SMTP server on loopback (smtp-server) that keeps every message it
// receives in the caught_mails table, so the mailbox page can show it and it
// survives restarts. Its built-in certificate has expired, so STARTTLS is off;
// AUTH is off because nothing leaves the machine.
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import type { Logger } from '../lib/logger';
import { CaughtMail } from '../models';

export interface SmtpFake {
  port: number;
  /** An SMTP_URL that reaches it. */
  url: string;
  /** Stops accepting connections (tests use it to simulate the mail server being down). */
  stop(): Promise<void>;
  /** Listens again on the same port. */
  start(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;

export async function startSmtpFake({ host = '127.0.0.1', port = 0, logger }: { host?: string; port?: number; logger: Logger }): Promise<SmtpFake> {
  let server: SMTPServer;
  let boundPort = port;

  const create = () =>
    new SMTPServer({
      disabledCommands: ['STARTTLS', 'AUTH'],
      logger: false,
      banner: 'Whorl local mail catcher',
      size: MAX_MESSAGE_BYTES,
      onData(stream, session, callback) {
        // Always consume the stream, or the client waits for ever.
        const chunks: Buffer[] = [];
        stream.on('data', (chunk: Buffer) => chunks.push(chunk));
        stream.on('end', () => {
          const raw = Buffer.concat(chunks);
          if ((stream as unknown as { sizeExceeded?: boolean }).sizeExceeded) {
            callback(Object.assign(new Error('Message too large'), { responseCode: 552 }));
            return;
          }
          void store(raw, session)
            .then(() => callback())
            .catch((error) => {
              logger.error('SMTP fake: could not store a message', error);
              callback(Object.assign(new Error('Temporary storage failure'), { responseCode: 451 }));
            });
        });
      },
    });

  async function store(raw: Buffer, session: { envelope: { mailFrom: false | { address: string }; rcptTo: { address: string }[] } }) {
    const parsed = await simpleParser(raw);
    const toHeader = Array.isArray(parsed.to) ? parsed.to.map((entry) => entry.text).join(', ') : parsed.to?.text ?? null;
    await CaughtMail.create({
      messageId: parsed.messageId ?? null,
      envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
      envelopeTo: session.envelope.rcptTo.map((recipient) => recipient.address),
      fromHeader: parsed.from?.text ?? null,
      toHeader,
      subject: parsed.subject ?? null,
      textBody: parsed.text ?? null,
      htmlBody: typeof parsed.html === 'string' ? parsed.html : null,
      sizeBytes: raw.length,
      receivedAt: new Date(),
    });
  }

  const listen = () =>
    new Promise<void>((resolve, reject) => {
      server = create();
      server.once('error', reject);
      server.listen(boundPort, host, () => {
        boundPort = (server.server.address() as AddressInfo).port;
        server.on('error', (error) => logger.error('SMTP fake error', error));
        resolve();
      });
    });

  await listen();
  let listening = true;
  return {
    get port() {
      return boundPort;
    },
    get url() {
      return `smtp://${host}:${boundPort}`;
    },
    async stop() {
      if (!listening) return;
      listening = false;
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
    async start() {
      if (listening) return;
      await listen();
      listening = true;
    },
  };
}
