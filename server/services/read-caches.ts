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

/**
 * Hooks live on the model classes and Model.init resets them, so this runs
 * after every initModels (createApp does both).
 */
export function installCacheInvalidation() {
  const dropRoles = () => roleCache.clear();
  Membership.addHook('afterCreate', dropRoles);
  Membership.addHook('afterUpdate', dropRoles);
  Membership.addHook('afterDestroy', dropRoles);
  Membership.addHook('afterBulkCreate', dropRoles);
  Membership.addHook('afterBulkUpdate', dropRoles);
  Membership.addHook('afterBulkDestroy', dropRoles);

  const dropUser = (u: { get(key: 'id'): unknown }) => void userCache.delete(u.get('id') as number);
  User.addHook('afterUpdate', dropUser);
  User.addHook('afterDestroy', dropUser);
  User.addHook('afterBulkUpdate', () => userCache.clear());

  const dropDetails = () => studyDetailCache.clear();
  Revision.addHook('afterCreate', (r) => void studyDetailCache.delete(r.get('studyId') as number));
  Revision.addHook('afterBulkCreate', dropDetails);
  Revision.addHook('afterBulkUpdate', dropDetails);
  Study.addHook('afterUpdate', (s) => void studyDetailCache.delete(s.get('id') as number));
  Study.addHook('afterBulkUpdate', dropDetails);
  Study.addHook('afterDestroy', (s) => {
    studyDetailCache.delete(s.get('id') as number);
    studyTeamCache.delete(s.get('id') as number);
  });
  // the detail shows the part's baseline pin
  Part.addHook('afterUpdate', dropDetails);
  Part.addHook('afterBulkUpdate', dropDetails);
  Part.addHook('afterDestroy', (p) => void partTeamCache.delete(p.get('id') as number));
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
