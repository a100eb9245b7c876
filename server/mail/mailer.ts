import nodemailer from 'nodemailer';
import type { Config } from '../config/index';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** nodemailer over SMTP: the local fake mail server in dev/tests, a real relay when SMTP_* say so. */
export function createMailer(mail: Config['mail']): Mailer {
  const transport = nodemailer.createTransport({
    host: mail.host,
    port: mail.port,
    secure: mail.secure,
    auth: mail.user ? { user: mail.user, pass: mail.password ?? '' } : undefined,
    // A fake on loopback offers no TLS; real relays are reached with TLS.
    ignoreTLS: mail.host === '127.0.0.1' && !mail.secure,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 10_000,
  });
  return {
    async send({ to, subject, text }) {
      await transport.sendMail({ from: mail.from, to, subject, text });
    },
    close: () => transport.close(),
  };
}
