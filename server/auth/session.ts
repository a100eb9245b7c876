import session from 'express-session';
import connectSessionSequelize from 'connect-session-sequelize';
import type { Sequelize } from 'sequelize';
import type { Config } from '../config/index';

const SequelizeStore = connectSessionSequelize(session.Store);

/**
 * Sessions live in MariaDB (table `sessions`, created by a migration, never
 * synced). The cookie is HttpOnly and SameSite=Lax (the OAuth callback is a
 * top-level GET navigation), Secure when the public URL is https.
 */
export function createSessionMiddleware(config: Config, sequelize: Sequelize) {
  const store = new SequelizeStore({
    db: sequelize,
    tableName: 'sessions',
    checkExpirationInterval: 15 * 60 * 1000,
    expiration: 7 * 24 * 60 * 60 * 1000,
  });
  // express-session "touches" an unchanged session on every request, which for
  // this store is an UPDATE per read. Sessions here expire a fixed 7 days after
  // sign-in (like the cookie), so the touch is skipped.
  store.touch = (_sid, _data, callback) => callback?.(null);
  const middleware = session({
    name: 'dwellform.sid',
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: false,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.publicUrl.startsWith('https://'),
      maxAge: 7 * 24 * 60 * 60 * 1000,
    },
  });
  // The expiry sweep is a timer; stop it on shutdown or the process never exits.
  const close = () => store.stopExpiringSessions();
  return { middleware, store, close };
}
