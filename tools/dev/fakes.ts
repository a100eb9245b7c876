/**
 * Starts the local fake OAuth provider and fake mail server in this process
 * (dev and demo mode). If a port already answers with our own fake (another
 * Dwellform process on this machine started it), that one is reused.
 */
import { loadConfig } from '../../server/config/index';
import { FAKE_OAUTH_SIGNATURE, startFakeOAuth } from './fake-oauth';
import { FAKE_MAIL_SIGNATURE, startFakeMail } from './fake-mail';

async function answersAs(url: string, signature: string): Promise<boolean> {
  try {
    const res = await fetch(`${url}/health`, { signal: AbortSignal.timeout(1_000) });
    return ((await res.json()) as { service?: string }).service === signature;
  } catch {
    return false;
  }
}

export async function startFakes(env: NodeJS.ProcessEnv = process.env) {
  const config = loadConfig(env);
  const closers: (() => Promise<void>)[] = [];
  if (config.oauth.fake) {
    const port = Number(env.FAKE_OAUTH_PORT ?? 5181);
    if (await answersAs(`http://127.0.0.1:${port}`, FAKE_OAUTH_SIGNATURE)) {
      console.log(`fake OAuth provider already running at http://127.0.0.1:${port}; reusing it`);
    } else {
      const oauth = await startFakeOAuth(port);
      closers.push(oauth.close);
      console.log(`fake OAuth provider at ${oauth.url}`);
    }
  }
  if (config.mail.fakeMailboxUrl) {
    if (await answersAs(config.mail.fakeMailboxUrl, FAKE_MAIL_SIGNATURE)) {
      console.log(`fake mail server already running (mailbox ${config.mail.fakeMailboxUrl}); reusing it`);
    } else {
      const mail = await startFakeMail({ smtp: config.mail.port, http: Number(new URL(config.mail.fakeMailboxUrl).port) });
      closers.push(mail.close);
      console.log(`fake mail server: SMTP 127.0.0.1:${mail.smtpPort}, mailbox ${mail.mailboxUrl}`);
    }
  }
  return async () => {
    for (const close of closers) await close();
  };
}
