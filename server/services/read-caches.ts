import type { Transaction } from 'sequelize';
import { Membership, Part, Revision, Study, User } from '../models/index';
import { ttlCache } from './ttl-cache';

/**
 * Caches for the study read path (GET /api/studies/:id answers without a
 * database round trip when warm). Invalidation is by model hooks, so any
 * change made through this process, by a route or directly through a model,
 * drops the entries it affects.
 */
export const roleCache = ttlCache<string, 'viewer' | 'engineer' | 'lead' | null>(5_000);
export const userCache = ttlCache<number, User | null>(5_000);
/** A study's or part's team never changes. */
export const studyTeamCache = ttlCache<number, number | null>(60 * 60_000);
export const partTeamCache = ttlCache<number, number | null>(60 * 60_000);
/** GET /api/studies/:id's body (without the caller's role), as JSON text. */
export const studyDetailCache = ttlCache<number, string>(30_000);

export const roleKey = (userId: number, teamId: number) => `${userId}:${teamId}`;

type WriteOptions = { transaction?: Transaction | null } | undefined;

/**
 * Drops an entry now and, for a write inside a transaction, again after the
 * commit: until then other connections still read the old rows, and a read in
 * that window must not leave them in the cache (the cache's epoch keeps such
 * a read from storing what it loaded).
 */
function dropAfterWrite(options: WriteOptions, drop: () => void) {
  drop();
  options?.transaction?.afterCommit(drop);
}

/**
 * Hooks live on the model classes and Model.init resets them, so this runs
 * after every initModels (createApp does both). The study detail shows the
 * study, its part's baseline pin, its latest revision, names of people and
 * the title of the study it was forked from.
 */
export function installCacheInvalidation() {
  const dropRoles = () => roleCache.clear();
  const dropDetails = () => studyDetailCache.clear();

  Membership.addHook('afterCreate', (_m, o) => dropAfterWrite(o, dropRoles));
  Membership.addHook('afterUpdate', (_m, o) => dropAfterWrite(o, dropRoles));
  Membership.addHook('afterDestroy', (_m, o) => dropAfterWrite(o, dropRoles));
  Membership.addHook('afterBulkCreate', (_m, o) => dropAfterWrite(o, dropRoles));
  Membership.addHook('afterBulkUpdate', (o) => dropAfterWrite(o, dropRoles));
  Membership.addHook('afterBulkDestroy', (o) => dropAfterWrite(o, dropRoles));

  const dropUser = (id: number) => () => {
    userCache.delete(id);
    dropDetails(); // names of owners and authors
  };
  User.addHook('afterUpdate', (u, o) => dropAfterWrite(o, dropUser(u.get('id') as number)));
  User.addHook('afterDestroy', (u, o) => dropAfterWrite(o, dropUser(u.get('id') as number)));
  User.addHook('afterBulkUpdate', (o) => dropAfterWrite(o, () => (userCache.clear(), dropDetails())));

  Revision.addHook('afterCreate', (r, o) => dropAfterWrite(o, () => void studyDetailCache.delete(r.get('studyId') as number)));
  Revision.addHook('afterBulkCreate', (_r, o) => dropAfterWrite(o, dropDetails));
  Revision.addHook('afterBulkUpdate', (o) => dropAfterWrite(o, dropDetails));
  // a new title also shows on every fork of the study
  Study.addHook('afterUpdate', (s, o) =>
    dropAfterWrite(o, (s as Study).changed('title') ? dropDetails : () => void studyDetailCache.delete(s.get('id') as number)),
  );
  Study.addHook('afterBulkUpdate', (o) => dropAfterWrite(o, dropDetails));
  Study.addHook('afterDestroy', (s, o) =>
    dropAfterWrite(o, () => {
      dropDetails();
      studyTeamCache.delete(s.get('id') as number);
    }),
  );
  Part.addHook('afterUpdate', (_p, o) => dropAfterWrite(o, dropDetails));
  Part.addHook('afterBulkUpdate', (o) => dropAfterWrite(o, dropDetails));
  Part.addHook('afterDestroy', (p, o) =>
    dropAfterWrite(o, () => {
      dropDetails();
      partTeamCache.delete(p.get('id') as number);
    }),
  );
}

/** Anything that rewrites tables underneath the models (truncate, restore) must start from empty caches. */
export function clearReadCaches() {
  for (const c of [roleCache, userCache, studyTeamCache, partTeamCache, studyDetailCache]) c.clear();
}

/** A team lookup that is remembered once found (a missing id is not: it may be created later). */
export async function cachedTeamOf(cache: typeof studyTeamCache, id: number, load: () => Promise<number | null>) {
  const hit = cache.get(id);
  if (hit !== undefined && hit !== null) return hit;
  const teamId = await load();
  if (teamId !== null) cache.set(id, teamId);
  return teamId;
}
