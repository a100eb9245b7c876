import { readFileSync } from 'node:fs';
import { z } from 'zod';

/**
 * Server settings, read once from the environment. Every value has a local
 * default so `npm start` works on a fresh machine; production deployments set
 * SESSION_SECRET and the OAuth/SMTP values explicitly.
 */
const port = (fallback: number) => z.coerce.number().int().min(1).max(65535).default(fallback);

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: port(5180),
  PUBLIC_URL: z.string().optional(),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: port(3307),
  DB_NAME: z.string().default('dwellform'),
  DB_USER: z.string().default('dwellform'),
  DB_PASSWORD: z.string().default('dwellform-dev'),
  DB_LOGGING: z.enum(['0', '1']).default('0'),
  SESSION_SECRET: z.string().min(16).default('dwellform-local-session-secret-change-me'),
  // OAuth: with GITHUB_CLIENT_ID/SECRET unset, the local fake provider is used.
  GITHUB_CLIENT_ID: z.string().optional(),
  GITHUB_CLIENT_SECRET: z.string().optional(),
  FAKE_OAUTH_PORT: port(5181),
  // Mail: SMTP to the local fake mail server unless SMTP_HOST is set.
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: port(5182),
  SMTP_SECURE: z.enum(['0', '1']).default('0'),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default('Dwellform <no-reply@dwellform.local>'),
  FAKE_MAIL_HTTP_PORT: port(5183),
  INVITE_TTL_HOURS: z.coerce.number().positive().max(24 * 30).default(72),
  AUTH_RATE_LIMIT: z.coerce.number().int().min(1).default(30),
  /** GET /api/me per client address per minute (every page load asks once). */
  ME_RATE_LIMIT: z.coerce.number().int().min(1).default(300),
});

export type Env = z.infer<typeof envSchema>;

export interface OAuthConfig {
  clientId: string;
  clientSecret: string;
  authorizationURL?: string;
  tokenURL?: string;
  userProfileURL?: string;
  userEmailURL?: string;
  /** true when the local fake provider stands in for GitHub */
  fake: boolean;
}

export interface Config {
  env: Env['NODE_ENV'];
  host: string;
  port: number;
  publicUrl: string;
  version: string;
  db: { host: string; port: number; name: string; user: string; password: string; logging: boolean };
  sessionSecret: string;
  oauth: OAuthConfig;
  mail: {
    host: string;
    port: number;
    secure: boolean;
    user?: string;
    password?: string;
    from: string;
    /** where the dev mailbox page reads caught mails (fake mail server only) */
    fakeMailboxUrl?: string;
  };
  inviteTtlHours: number;
  authRateLimit: number;
  meRateLimit: number;
}

// The version has one home, package.json; npm and tsx run from the project root.
export const APP_VERSION: string = (
  JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string }
).version;

export function loadConfig(source: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new Error(`Invalid environment variable ${String(issue.path[0])}: ${issue.message}`);
  }
  const e = parsed.data;
  const publicUrl = e.PUBLIC_URL ?? `http://${e.HOST}:${e.PORT}`;
  const fake = !e.GITHUB_CLIENT_ID || !e.GITHUB_CLIENT_SECRET;
  const fakeBase = `http://127.0.0.1:${e.FAKE_OAUTH_PORT}`;
  // Mail to a loopback relay without credentials is the local fake (tools/dev/fake-mail.ts).
  const usesFakeMail = e.SMTP_HOST === '127.0.0.1' && !e.SMTP_USER;
  return {
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    publicUrl,
    version: APP_VERSION,
    db: {
      host: e.DB_HOST,
      port: e.DB_PORT,
      name: e.DB_NAME,
      user: e.DB_USER,
      password: e.DB_PASSWORD,
      logging: e.DB_LOGGING === '1',
    },
    sessionSecret: e.SESSION_SECRET,
    oauth: fake
      ? {
          clientId: 'dwellform-local',
          clientSecret: 'dwellform-local-secret',
          authorizationURL: `${fakeBase}/login/oauth/authorize`,
          tokenURL: `${fakeBase}/login/oauth/access_token`,
          userProfileURL: `${fakeBase}/user`,
          userEmailURL: `${fakeBase}/user/emails`,
          fake: true,
        }
      : { clientId: e.GITHUB_CLIENT_ID!, clientSecret: e.GITHUB_CLIENT_SECRET!, fake: false },
    mail: {
      host: e.SMTP_HOST,
      port: e.SMTP_PORT,
      secure: e.SMTP_SECURE === '1',
      user: e.SMTP_USER,
      password: e.SMTP_PASSWORD,
      from: e.MAIL_FROM,
      // The mailbox exists only while the local fake mail server catches mail.
      fakeMailboxUrl: usesFakeMail ? `http://127.0.0.1:${e.FAKE_MAIL_HTTP_PORT}` : undefined,
    },
    inviteTtlHours: e.INVITE_TTL_HOURS,
    authRateLimit: e.AUTH_RATE_LIMIT,
    meRateLimit: e.ME_RATE_LIMIT,
  };
}
