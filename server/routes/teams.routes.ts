import { Router, type Request } from 'express';
import { Op, type Sequelize } from 'sequelize';
import { currentUser, requireAdmin, requireTeamRole, requireUser } from '../auth/access';
import { Invite, Membership, Part, Revision, Study, Team, User } from '../models/index';
import { HttpError, notFound } from '../middleware/http-error';
import { recordAudit } from '../services/audit.service';
import { auditEvents } from '../services/audit-view';
import { forkOrigins } from '../services/fork-origin';
import { createInvite, inviteView, resendInvite, type InviteContext } from '../services/invite.service';
import { createPartBody, createTeamBody, idParam, inviteBody, roleBody } from './request-schemas';

const teamOfRoute = async (req: Request) => {
  const id = idParam(req.params.teamId);
  return id && (await Team.count({ where: { id } })) ? id : null;
};
const userAttrs = ['id', 'login', 'name'];
const person = (u?: User | null) => (u ? { id: u.id, login: u.login, name: u.name } : null);

export async function baselineView(part: Part) {
  if (!part.baselineRevisionId) return null;
  const revision = await Revision.findByPk(part.baselineRevisionId, {
    include: [{ model: Study, as: 'study', attributes: ['id', 'title'] }],
    attributes: ['id', 'number', 'studyId', 'summary', 'createdAt'],
  });
  const pinner = part.baselinePinnedBy ? await User.findByPk(part.baselinePinnedBy, { attributes: userAttrs }) : null;
  const study = (revision as (Revision & { study?: Study }) | null)?.study;
  return {
    revisionId: part.baselineRevisionId,
    studyId: revision?.studyId ?? null,
    studyTitle: study?.title ?? null,
    number: revision?.number ?? null,
    summary: revision?.summary ?? null,
    note: part.baselineNote,
    pinnedAt: part.baselinePinnedAt,
    pinnedBy: person(pinner),
  };
}

export function teamRoutes(sequelize: Sequelize, inviteCtx: InviteContext): Router {
  const router = Router();
  const canRead = requireTeamRole('read', teamOfRoute);
  const canWrite = requireTeamRole('write', teamOfRoute);
  const canManage = requireTeamRole('manageMembers', teamOfRoute);
  const canViewMembers = requireTeamRole('viewMembers', teamOfRoute);
  const canAudit = requireTeamRole('readAudit', teamOfRoute);

  router.get('/teams', requireUser, async (req, res) => {
    const user = currentUser(req);
    const memberships = await Membership.findAll({ where: { userId: user.id } });
    const roleOf = new Map(memberships.map((m) => [m.teamId, m.role]));
    const teams = await Team.findAll({
      where: user.isAdmin ? {} : { id: { [Op.in]: [...roleOf.keys()] } },
      order: [['name', 'ASC']],
    });
    res.json(teams.map((t) => ({ id: t.id, slug: t.slug, name: t.name, description: t.description, role: roleOf.get(t.id) ?? null })));
  });

  router.post('/teams', requireAdmin, async (req, res) => {
    const body = createTeamBody.parse(req.body);
    if (await Team.count({ where: { slug: body.slug } })) throw new HttpError(409, `A team with slug '${body.slug}' exists.`, { field: 'slug' });
    const team = await sequelize.transaction(async (transaction) => {
      const t = await Team.create({ slug: body.slug, name: body.name, description: body.description ?? null }, { transaction });
      await recordAudit({ teamId: t.id, actorId: currentUser(req).id, action: 'team.create', subjectType: 'team', subjectId: t.id, details: { slug: t.slug, name: t.name } }, transaction);
      return t;
    });
    // A team starts with no members; the admin names its first lead, who joins through the mailed link.
    const user = currentUser(req);
    const invite = body.leadEmail ? await createInvite(inviteCtx, { teamId: team.id, email: body.leadEmail, role: 'lead', invitedBy: { id: user.id, name: user.name } }) : null;
    res.status(201).json({ id: team.id, slug: team.slug, name: team.name, description: team.description, leadInvite: invite ? inviteView(invite) : null });
  });

  router.get('/teams/:teamId', canRead, async (req, res) => {
    const teamId = req.teamAccess!.teamId;
    const team = (await Team.findByPk(teamId))!;
    const parts = await Part.findAll({ where: { teamId }, order: [['partNumber', 'ASC']] });
    const studyCounts = await Study.count({ where: { teamId }, group: ['partId'] });
    const countOf = new Map((studyCounts as unknown as { partId: number; count: number }[]).map((c) => [c.partId, Number(c.count)]));
    const recentStudies = await Study.findAll({
      where: { teamId },
      order: [['updatedAt', 'DESC']],
      limit: 10,
      include: [
        { model: User, as: 'owner', attributes: userAttrs },
        { model: Part, as: 'part', attributes: ['id', 'partNumber', 'name'] },
      ],
    });
    const recentRevisions = await Revision.findAll({
      include: [
        { model: Study, as: 'study', where: { teamId }, attributes: ['id', 'title'] },
        { model: User, as: 'author', attributes: userAttrs },
      ],
      attributes: ['id', 'number', 'message', 'createdAt', 'studyId', 'restoredFromNumber'],
      order: [['createdAt', 'DESC'], ['id', 'DESC']],
      limit: 10,
    });
    const origins = await forkOrigins(recentStudies);
    // who changed what: every audited kind (saves, forks, pins, roles, invitations, uploads, reviews)
    const activity = await auditEvents({ teamId, action: { [Op.ne]: 'seed.demo' } }, 15);
    res.json({
      team: { id: team.id, slug: team.slug, name: team.name, description: team.description },
      role: req.teamAccess!.role,
      parts: await Promise.all(
        parts.map(async (p) => ({
          id: p.id,
          partNumber: p.partNumber,
          name: p.name,
          description: p.description,
          studyCount: countOf.get(p.id) ?? 0,
          baseline: await baselineView(p),
        })),
      ),
      recentStudies: recentStudies.map((s) => {
        const x = s as Study & { owner?: User; part?: Part };
        return {
          id: x.id,
          title: x.title,
          latestRevisionNumber: x.latestRevisionNumber,
          updatedAt: x.updatedAt,
          forkedFromRevisionId: x.forkedFromRevisionId,
          forkedFrom: origins.get(x.id) ?? null,
          owner: person(x.owner),
          part: x.part ? { id: x.part.id, partNumber: x.part.partNumber, name: x.part.name } : null,
        };
      }),
      recentRevisions: recentRevisions.map((r) => {
        const x = r as Revision & { study?: Study; author?: User };
        return {
          id: x.id,
          studyId: x.studyId,
          studyTitle: x.study?.title ?? '',
          number: x.number,
          message: x.message,
          restoredFromNumber: x.restoredFromNumber,
          createdAt: x.createdAt,
          author: person(x.author),
        };
      }),
      activity,
    });
  });

  router.get('/teams/:teamId/parts', canRead, async (req, res) => {
    const parts = await Part.findAll({ where: { teamId: req.teamAccess!.teamId }, order: [['partNumber', 'ASC']] });
    res.json(parts.map((p) => ({ id: p.id, partNumber: p.partNumber, name: p.name, description: p.description, baselineRevisionId: p.baselineRevisionId })));
  });

  router.post('/teams/:teamId/parts', canWrite, async (req, res) => {
    const body = createPartBody.parse(req.body);
    const teamId = req.teamAccess!.teamId;
    if (await Part.count({ where: { teamId, partNumber: body.partNumber } })) {
      throw new HttpError(409, `Part number ${body.partNumber} already exists in this team.`, { field: 'partNumber' });
    }
    const part = await sequelize.transaction(async (transaction) => {
      const p = await Part.create(
        { teamId, partNumber: body.partNumber, name: body.name, description: body.description ?? null, baselineRevisionId: null, baselineNote: null, baselinePinnedBy: null, baselinePinnedAt: null },
        { transaction },
      );
      await recordAudit({ teamId, actorId: currentUser(req).id, action: 'part.create', subjectType: 'part', subjectId: p.id, details: { partNumber: p.partNumber, partName: p.name } }, transaction);
      return p;
    });
    res.status(201).json({ id: part.id, partNumber: part.partNumber, name: part.name, description: part.description, baselineRevisionId: null });
  });

  router.get('/teams/:teamId/members', canViewMembers, async (req, res) => {
    const members = await Membership.findAll({
      where: { teamId: req.teamAccess!.teamId },
      include: [{ model: User, as: 'user', attributes: ['id', 'login', 'name', 'email', 'avatarUrl'] }],
      order: [['createdAt', 'ASC']],
    });
    res.json(
      members.map((m) => {
        const u = (m as Membership & { user: User }).user;
        return { userId: u.id, login: u.login, name: u.name, email: u.email, role: m.role, since: m.createdAt };
      }),
    );
  });

  router.patch('/teams/:teamId/members/:userId', canManage, async (req, res) => {
    const { role } = roleBody.parse(req.body);
    const teamId = req.teamAccess!.teamId;
    const membership = await Membership.findOne({ where: { teamId, userId: idParam(req.params.userId) ?? 0 } });
    if (!membership) throw notFound('That person is not a member of this team.');
    if (membership.role === 'lead' && role !== 'lead' && (await Membership.count({ where: { teamId, role: 'lead' } })) === 1) {
      throw new HttpError(409, 'A team keeps at least one lead; make someone else lead first.');
    }
    const from = membership.role;
    const member = await User.findByPk(membership.userId, { attributes: ['name'] });
    await sequelize.transaction(async (transaction) => {
      await membership.update({ role }, { transaction });
      await recordAudit({ teamId, actorId: currentUser(req).id, action: 'member.role', subjectType: 'membership', subjectId: membership.id, details: { userId: membership.userId, userName: member?.name ?? null, from, to: role } }, transaction);
    });
    res.json({ userId: membership.userId, role });
  });

  router.delete('/teams/:teamId/members/:userId', canManage, async (req, res) => {
    const teamId = req.teamAccess!.teamId;
    const membership = await Membership.findOne({ where: { teamId, userId: idParam(req.params.userId) ?? 0 } });
    if (!membership) throw notFound('That person is not a member of this team.');
    if (membership.role === 'lead' && (await Membership.count({ where: { teamId, role: 'lead' } })) === 1) {
      throw new HttpError(409, 'A team keeps at least one lead; make someone else lead first.');
    }
    const member = await User.findByPk(membership.userId, { attributes: ['name'] });
    await sequelize.transaction(async (transaction) => {
      await membership.destroy({ transaction });
      await recordAudit({ teamId, actorId: currentUser(req).id, action: 'member.remove', subjectType: 'membership', subjectId: membership.id, details: { userId: membership.userId, userName: member?.name ?? null, role: membership.role } }, transaction);
    });
    res.status(204).end();
  });

  router.get('/teams/:teamId/invites', canManage, async (req, res) => {
    const invites = await Invite.findAll({ where: { teamId: req.teamAccess!.teamId }, order: [['createdAt', 'DESC']] });
    res.json(invites.map(inviteView));
  });

  router.post('/teams/:teamId/invites', canManage, async (req, res) => {
    const body = inviteBody.parse(req.body);
    const user = currentUser(req);
    const invite = await createInvite(inviteCtx, { teamId: req.teamAccess!.teamId, email: body.email, role: body.role, invitedBy: { id: user.id, name: user.name } });
    res.status(201).json(inviteView(invite));
  });

  router.post('/teams/:teamId/invites/:inviteId/resend', canManage, async (req, res) => {
    const invite = await Invite.findOne({ where: { id: idParam(req.params.inviteId) ?? 0, teamId: req.teamAccess!.teamId } });
    if (!invite) throw notFound('Invitation not found.');
    const user = currentUser(req);
    res.json(inviteView(await resendInvite(inviteCtx, invite, { id: user.id, name: user.name })));
  });

  router.get('/teams/:teamId/audit', canAudit, async (req, res) => {
    res.json(await auditEvents({ teamId: req.teamAccess!.teamId }, 200));
  });

  return router;
}
