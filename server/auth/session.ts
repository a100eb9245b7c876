import session from 'express-session';
import connectSessionSequelize from 'connect-session-sequelize';
import type { Sequelize } from 'sequelize';
import type { Config } from '../config/index';

import { ttlCache } from '../services/ttl-cache';

const SequelizeStore = connectSessionSequelize(session.Store);

/**
 * Sessions live in MariaDB (table `sessions`, created by a migration, never
 * synced). The cookie is HttpOnly and SameSite=Lax (the OAuth callback is a
 * top-level GET navigation), Secure when the public URL is https.
 */
/**
 * Reads of a session within a few seconds of the last one come from memory
 * (as JSON, parsed per request, so no two requests share objects); concurrent
 * misses share one query. Every write or destroy through this store replaces
 * or drops the entry, and a destroy drops it again once the row is gone, so a
 * read racing the sign-out cannot put the session back.
 */
function cacheSessionReads(store: InstanceType<typeof SequelizeStore>) {
  const cache = ttlCache<string, string | undefined>(5_000);
  const get = store.get.bind(store);
  const set = store.set.bind(store);
  const destroy = store.destroy.bind(store);
  const load = (sid: string) =>
    new Promise<string | undefined>((resolve, reject) => {
      get(sid, (err, data) => (err ? reject(err) : resolve(data ? JSON.stringify(data) : undefined)));
    });
  store.get = (sid, callback) => {
    cache.getOrLoad(sid, () => load(sid)).then(
      (json) => callback(null, json === undefined ? null : JSON.parse(json)),
      (err: unknown) => callback(err),
    );
  };
  store.set = (sid, data, callback) => {
    cache.set(sid, JSON.stringify(data));
    set(sid, data, (err?: unknown) => {
      if (err) cache.delete(sid);
      callback?.(err);
    });
  };
  store.destroy = (sid, callback) => {
    cache.delete(sid);
    destroy(sid, (err?: unknown) => {
      cache.delete(sid);
      callback?.(err);
    });
  };
}

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
  cacheSessionReads(store);
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
