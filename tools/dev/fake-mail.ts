/**
 * A local stand-in for a mail relay, for dev, demo and tests: smtp-server
 * accepts every message on 127.0.0.1 and keeps it in memory; a tiny HTTP
 * endpoint lists them (the dev-only /api/dev/mailbox page reads it).
 *
 *   SMTP  127.0.0.1:FAKE_MAIL_SMTP_PORT (5182)
 *   HTTP  127.0.0.1:FAKE_MAIL_HTTP_PORT (5183)  GET /messages, DELETE /messages, GET /health
 */
import type { AddressInfo } from 'node:net';
import { pathToFileURL } from 'node:url';
import express from 'express';
import { SMTPServer } from 'smtp-server';

export const FAKE_MAIL_SIGNATURE = 'dwellform-fake-mail';

export interface CaughtMail {
  id: number;
  from: string;
  to: string[];
  subject: string;
  text: string;
  receivedAt: string;
}

/** Quoted-printable (RFC 2045 §6.7): soft breaks `=\r\n` and `=XX` bytes. */
function decodeQuotedPrintable(body: string): string {
  const bytes = body.replace(/=\r?\n/g, '').replace(/=([0-9A-F]{2})/gi, (_, h: string) => String.fromCharCode(parseInt(h, 16)));
  return Buffer.from(bytes, 'latin1').toString('utf8');
}

/** Encoded-word headers (RFC 2047), as nodemailer writes non-ASCII subjects. */
function decodeHeader(value: string): string {
  return value.replace(/=\?utf-8\?([bq])\?([^?]*)\?=/gi, (_, enc: string, text: string) =>
    enc.toLowerCase() === 'b' ? Buffer.from(text, 'base64').toString('utf8') : decodeQuotedPrintable(text.replace(/_/g, ' ')),
  ).replace(/\?=\s+=\?/g, '');
}

/** Enough MIME for the plain-text mails the app sends. */
export function parseMail(raw: string): { subject: string; text: string } {
  const split = raw.indexOf('\r\n\r\n') >= 0 ? raw.indexOf('\r\n\r\n') : raw.indexOf('\n\n');
  const head = raw.slice(0, split).replace(/\r?\n[ \t]+/g, ' ');
  const body = raw.slice(split).replace(/^\s+/, '');
  const header = (name: string) => head.match(new RegExp(`^${name}:\\s*(.*)$`, 'im'))?.[1]?.trim() ?? '';
  const encoding = header('Content-Transfer-Encoding').toLowerCase();
  const text =
    encoding === 'quoted-printable' ? decodeQuotedPrintable(body) : encoding === 'base64' ? Buffer.from(body, 'base64').toString('utf8') : body;
  return { subject: decodeHeader(header('Subject')), text: text.replace(/\r\n/g, '\n').trimEnd() };
}

export async function startFakeMail(
  ports: { smtp?: number; http?: number } = {
    smtp: Number(process.env.FAKE_MAIL_SMTP_PORT ?? process.env.SMTP_PORT ?? 5182),
    http: Number(process.env.FAKE_MAIL_HTTP_PORT ?? 5183),
  },
) {
  const messages: CaughtMail[] = [];
  let nextId = 1;

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    banner: FAKE_MAIL_SIGNATURE,
    size: 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const { subject, text } = parseMail(Buffer.concat(chunks).toString('utf8'));
        messages.push({
          id: nextId++,
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map((r) => r.address),
          subject,
          text,
          receivedAt: new Date().toISOString(),
        });
        if (messages.length > 500) messages.shift();
        callback();
      });
    },
  });
  smtp.on('error', (err) => console.error(`fake mail (SMTP): ${err.message}`));

  const app = express();
  app.get('/health', (_req, res) => {
    res.json({ service: FAKE_MAIL_SIGNATURE });
  });
  app.get('/messages', (_req, res) => {
    res.json([...messages].reverse());
  });
  app.delete('/messages', (_req, res) => {
    messages.length = 0;
    res.status(204).end();
  });

  const smtpPort = await new Promise<number>((resolve, reject) => {
    smtp.server.once('error', reject);
    smtp.listen(ports.smtp ?? 0, '127.0.0.1', () => resolve((smtp.server.address() as AddressInfo).port));
  });
  let httpServer: ReturnType<typeof app.listen>;
  const httpPort = await new Promise<number>((resolve, reject) => {
    httpServer = app.listen(ports.http ?? 0, '127.0.0.1', (err?: Error) => (err ? reject(err) : resolve((httpServer.address() as AddressInfo).port)));
    httpServer.on('error', reject);
  }).catch(async (err) => {
    await new Promise<void>((done) => smtp.close(() => done()));
    throw err;
  });

  return {
    smtpPort,
    httpPort,
    mailboxUrl: `http://127.0.0.1:${httpPort}`,
    messages,
    close: async () => {
      await new Promise<void>((done) => smtp.close(() => done()));
      await new Promise<void>((done) => httpServer.close(() => done()));
    },
  };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  startFakeMail().then(
    ({ smtpPort, mailboxUrl }) => console.log(`fake mail server: SMTP 127.0.0.1:${smtpPort}, mailbox ${mailboxUrl}/messages`),
    (err: NodeJS.ErrnoException) => {
      console.error(
        err.code === 'EADDRINUSE'
          ? 'fake mail: a port on 127.0.0.1 is in use; set SMTP_PORT / FAKE_MAIL_HTTP_PORT to free ports.'
          : `fake mail: ${err.message}`,
      );
      process.exit(1);
    },
  );
}
