/**
 * Who may do what: one table of actions and the least team role each needs,
 * and the middleware that enforces it on every route. Non-members of a team
 * get 404 (a team's parts and studies are not revealed to outsiders);
 * members whose role is too low, and site admins (who know every team), get
 * 403; anonymous callers get 401.
 */
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { forbidden, notFound, unauthorized } from '../middleware/http-error';
import { Membership, type TeamRole, type User } from '../models/index';
import { roleCache, roleKey } from '../services/read-caches';

export const ROLE_RANK: Record<TeamRole, number> = { viewer: 1, engineer: 2, lead: 3 };

export const ACTION_ROLE = {
  read: 'viewer', // read, compare, export
  viewMembers: 'viewer',
  write: 'engineer', // create parts and studies, save, restore, fork into the team, upload
  pinBaseline: 'lead',
  manageMembers: 'lead', // roles, invitations
  readAudit: 'lead',
  review: 'lead', // the use-as-is / rework / scrap decision on a run log
} as const satisfies Record<string, TeamRole>;

export type TeamAction = keyof typeof ACTION_ROLE;

/** Site admins manage teams and their members everywhere, but read no team's studies unless members. */
const ADMIN_ACTIONS: ReadonlySet<TeamAction> = new Set(['viewMembers', 'manageMembers', 'readAudit']);

export function roleAllows(role: TeamRole | null, action: TeamAction): boolean {
  return role !== null && ROLE_RANK[role] >= ROLE_RANK[ACTION_ROLE[action]];
}

export interface TeamAccess {
  teamId: number;
  role: TeamRole | null;
}

declare module 'express-serve-static-core' {
  interface Request {
    teamAccess?: TeamAccess;
  }
}

export function currentUser(req: Request): User {
  if (!req.user) throw unauthorized();
  return req.user as User;
}

export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.isAuthenticated?.() || !req.user) return next(unauthorized());
  next();
};

export const requireAdmin: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(unauthorized());
  if (!(req.user as User).isAdmin) return next(forbidden('Only a site admin may do this.'));
  next();
};

export async function roleIn(userId: number, teamId: number): Promise<TeamRole | null> {
  return roleCache.getOrLoad(roleKey(userId, teamId), async () => {
    const m = await Membership.findOne({ where: { userId, teamId }, attributes: ['role'] });
    return m?.role ?? null;
  });
}

/**
 * Checks the signed-in user's role in the team that owns the resource. The
 * team id comes from `resolveTeam` (from the route's :teamId, or the team of
 * the part/study/revision named in the URL). Sets req.teamAccess.
 */
export function requireTeamRole(action: TeamAction, resolveTeam: (req: Request) => Promise<number | null>): RequestHandler {
  return async (req: Request, _res: Response, next: NextFunction) => {
    if (!req.user) return next(unauthorized());
    const user = req.user as User;
    const teamId = await resolveTeam(req);
    if (teamId === null) return next(notFound());
    const role = await roleIn(user.id, teamId);
    req.teamAccess = { teamId, role };
    if (roleAllows(role, action)) return next();
    if (user.isAdmin && ADMIN_ACTIONS.has(action)) return next();
    if (role === null && !user.isAdmin) return next(notFound());
    next(forbidden(`Your role (${role ?? 'none'}) does not allow this; it needs ${ACTION_ROLE[action]} or above.`));
  };
}
