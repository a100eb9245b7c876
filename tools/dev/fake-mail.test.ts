import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import nodemailer from 'nodemailer';
import { parseMail, startFakeMail } from './fake-mail';

describe('parseMail', () => {
  it('decodes quoted-printable bodies, soft line breaks included (RFC 2045 §6.7)', () => {
    const raw = 'Subject: Hi\r\nContent-Transfer-Encoding: quoted-printable\r\n\r\nCure at 180 =C2=B0C for a lon=\r\ng dwell\r\n';
    expect(parseMail(raw)).toEqual({ subject: 'Hi', text: 'Cure at 180 °C for a long dwell' });
  });

  it('decodes encoded-word subjects (RFC 2047)', () => {
    const raw = 'Subject: =?UTF-8?Q?Invitation_=E2=80=94_Tail_Cell?=\r\n\r\nbody';
    expect(parseMail(raw).subject).toBe('Invitation — Tail Cell');
  });
});

describe('the fake mail server', () => {
  let server: Awaited<ReturnType<typeof startFakeMail>>;
  beforeAll(async () => {
    server = await startFakeMail({ smtp: 0, http: 0 });
  });
  afterAll(() => server.close());

  it('catches what nodemailer sends over SMTP and lists it over HTTP', async () => {
    const transport = nodemailer.createTransport({ host: '127.0.0.1', port: server.smtpPort, secure: false, ignoreTLS: true });
    const longLink = `http://127.0.0.1:5180/invite/${'x'.repeat(90)}`;
    await transport.sendMail({ from: 'a@example.test', to: 'b@example.test', subject: 'Join the team — 90 °C', text: `Open ${longLink}\n` });
    transport.close();
    const listed = (await (await fetch(`${server.mailboxUrl}/messages`)).json()) as { to: string[]; subject: string; text: string }[];
    expect(listed).toHaveLength(1);
    expect(listed[0].to).toEqual(['b@example.test']);
    expect(listed[0].subject).toBe('Join the team — 90 °C');
    // a long link survives the transfer encoding intact
    expect(listed[0].text).toContain(longLink);
  });
});
