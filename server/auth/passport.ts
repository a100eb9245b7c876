import passport from 'passport';
import { Strategy as GitHubStrategy, type Profile, type StrategyOptions } from 'passport-github2';
import type { Config } from '../config/index';
import { User } from '../models/index';
import { userCache } from '../services/read-caches';

export interface ProviderProfile {
  providerId: string;
  login: string;
  name: string;
  email: string | null;
  avatarUrl: string | null;
}

export function profileFromGitHub(profile: Profile): ProviderProfile {
  return {
    providerId: String(profile.id),
    login: profile.username ?? `user-${profile.id}`,
    name: profile.displayName || profile.username || `User ${profile.id}`,
    email: profile.emails?.[0]?.value ?? null,
    avatarUrl: profile.photos?.[0]?.value ?? null,
  };
}

/**
 * The verify step: the provider id decides who you are. A first sign-in
 * creates the user; the seeded demo users carry their provider ids, so they
 * keep their memberships and roles. Profile fields are refreshed on each sign-in.
 */
export async function findOrCreateUser(p: ProviderProfile): Promise<User> {
  const existing = await User.findOne({ where: { providerId: p.providerId } });
  if (existing) {
    await existing.update({ name: p.name, avatarUrl: p.avatarUrl, ...(p.email ? { email: p.email } : {}) });
    return existing;
  }
  // A login or e-mail already taken by someone else must not block sign-in.
  const loginTaken = await User.findOne({ where: { login: p.login } });
  const emailTaken = p.email ? await User.findOne({ where: { email: p.email } }) : null;
  return User.create({
    providerId: p.providerId,
    login: loginTaken ? `${p.login}-${p.providerId}` : p.login,
    name: p.name,
    email: emailTaken ? null : p.email,
    avatarUrl: p.avatarUrl,
    isAdmin: false,
  });
}

/** Configures passport with passport-github2; the URLs point at the local fake provider unless real credentials are set. */
export function configurePassport(config: Config): passport.PassportStatic {
  const instance = new passport.Passport() as unknown as passport.PassportStatic;
  const { oauth } = config;
  instance.use(
    new GitHubStrategy(
      {
        clientID: oauth.clientId,
        clientSecret: oauth.clientSecret,
        callbackURL: `${config.publicUrl}/api/auth/github/callback`,
        scope: ['read:user', 'user:email'],
        // passport-oauth2 keeps a random state in the session and checks it on the callback
        state: true as unknown as string,
        ...(oauth.authorizationURL
          ? {
              authorizationURL: oauth.authorizationURL,
              tokenURL: oauth.tokenURL,
              userProfileURL: oauth.userProfileURL,
              userEmailURL: oauth.userEmailURL,
            }
          : {}),
      } satisfies StrategyOptions,
      (_accessToken: string, _refreshToken: string, profile: Profile, done: (err: unknown, user?: User) => void) => {
        findOrCreateUser(profileFromGitHub(profile)).then((user) => done(null, user), done);
      },
    ),
  );
  instance.serializeUser((user, done) => done(null, (user as User).id));
  instance.deserializeUser((id: number, done) => {
    userCache.getOrLoad(id, () => User.findByPk(id)).then((user) => done(null, user ?? false), done);
  });
  return instance;
}
