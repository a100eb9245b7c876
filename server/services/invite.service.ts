import crypto from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { Invite, Membership, Team, type TeamRole } from '../models/index';
import type { Mailer } from '../mail/mailer';
import { HttpError, notFound } from '../middleware/http-error';
import { recordAudit } from './audit.service';

export const hashToken = (token: string) => crypto.createHash('sha256').update(token).digest('hex');
const newToken = () => crypto.randomBytes(32).toString('base64url');

export interface InviteContext {
  sequelize: Sequelize;
  mailer: Mailer;
  publicUrl: string;
  ttlHours: number;
}

export function inviteView(invite: Invite) {
  const now = Date.now();
  return {
    id: invite.id,
    teamId: invite.teamId,
    email: invite.email,
    role: invite.role,
    expiresAt: invite.expiresAt,
    acceptedAt: invite.acceptedAt,
    status: invite.acceptedAt ? 'accepted' : invite.expiresAt.getTime() <= now ? 'expired' : 'open',
    mailStatus: invite.mailStatus,
    mailError: invite.mailError,
    createdAt: invite.createdAt,
  };
}

const expiryFormat = new Intl.DateTimeFormat('en-GB', {
  weekday: 'long',
  day: 'numeric',
  month: 'long',
  year: 'numeric',
  hour: '2-digit',
  minute: '2-digit',
  timeZone: 'UTC',
  timeZoneName: 'short',
});

/** The expiry as a person reads it, with its time zone: "Tuesday, 1 December 2026 at 23:15 UTC". */
export const formatExpiry = (date: Date) => expiryFormat.format(date);

/**
 * Sends the invitation mail and records the outcome on the invite. A failed
 * send is reported back (mailStatus 'failed' and the reason); the invite
 * record stays so a lead can resend.
 */
async function mailInvite(ctx: InviteContext, invite: Invite, team: Team, token: string, inviterName: string) {
  const link = `${ctx.publicUrl}/invite/${token}`;
  try {
    await ctx.mailer.send({
      to: invite.email,
      subject: `${inviterName} invited you to ${team.name} on Dwellform`,
      text:
        `${inviterName} invited you to join the team "${team.name}" on Dwellform as ${invite.role}.\n\n` +
        `Open this link to accept (it works once and expires on ${formatExpiry(invite.expiresAt)}):\n${link}\n`,
    });
    await invite.update({ mailStatus: 'sent', mailError: null });
  } catch (err) {
    await invite.update({ mailStatus: 'failed', mailError: String((err as Error).message).slice(0, 500) });
  }
  return link;
}

export async function createInvite(
  ctx: InviteContext,
  input: { teamId: number; email: string; role: TeamRole; invitedBy: { id: number; name: string } },
) {
  const team = await Team.findByPk(input.teamId);
  if (!team) throw notFound('Team not found.');
  const token = newToken();
  const invite = await ctx.sequelize.transaction(async (transaction) => {
    const created = await Invite.create(
      {
        teamId: input.teamId,
        email: input.email,
        role: input.role,
        tokenHash: hashToken(token),
        expiresAt: new Date(Date.now() + ctx.ttlHours * 3600_000),
        acceptedAt: null,
        acceptedBy: null,
        invitedBy: input.invitedBy.id,
        mailError: null,
      },
      { transaction },
    );
    await recordAudit(
      { teamId: input.teamId, actorId: input.invitedBy.id, action: 'invite.create', subjectType: 'invite', subjectId: created.id, details: { email: input.email, role: input.role } },
      transaction,
    );
    return created;
  });
  await mailInvite(ctx, invite, team, token, input.invitedBy.name);
  return invite;
}

/** A fresh token and expiry for an open invite, mailed again (the old link stops working). */
export async function resendInvite(ctx: InviteContext, invite: Invite, by: { id: number; name: string }) {
  if (invite.acceptedAt) throw new HttpError(409, 'This invitation was already accepted.');
  const team = await Team.findByPk(invite.teamId);
  if (!team) throw notFound('Team not found.');
  const token = newToken();
  await invite.update({ tokenHash: hashToken(token), expiresAt: new Date(Date.now() + ctx.ttlHours * 3600_000), mailStatus: 'pending' });
  await recordAudit({ teamId: invite.teamId, actorId: by.id, action: 'invite.resend', subjectType: 'invite', subjectId: invite.id, details: { email: invite.email } });
  await mailInvite(ctx, invite, team, token, by.name);
  return invite;
}

async function findUsable(token: string) {
  const invite = await Invite.findOne({ where: { tokenHash: hashToken(token) }, include: [{ model: Team, as: 'team' }] });
  if (!invite) throw notFound('This invitation link is not valid.');
  if (invite.acceptedAt) throw new HttpError(410, 'This invitation was already used.');
  if (invite.expiresAt.getTime() <= Date.now()) throw new HttpError(410, 'This invitation has expired; ask a lead to send a new one.');
  return invite as Invite & { team: Team };
}

export async function previewInvite(token: string) {
  const invite = await findUsable(token);
  return { teamId: invite.teamId, teamName: invite.team.name, role: invite.role, email: invite.email, expiresAt: invite.expiresAt };
}

/**
 * Accepts once: the update is conditional on `accepted_at IS NULL`, so two
 * concurrent accepts cannot both succeed. An existing member gets the invited
 * role only if it is higher than the one they hold.
 */
export async function acceptInvite(sequelize: Sequelize, token: string, user: { id: number; email: string | null }) {
  const invite = await findUsable(token);
  if (!user.email || user.email.trim().toLowerCase() !== invite.email.trim().toLowerCase()) {
    throw new HttpError(
      403,
      `This invitation was sent to ${invite.email}, but you are signed in as ${user.email ?? 'an account with no e-mail address'}. Sign in with the invited address, or ask a lead to invite this one.`,
    );
  }
  const userId = user.id;
  return sequelize.transaction(async (transaction) => {
    const [claimed] = await Invite.update(
      { acceptedAt: new Date(), acceptedBy: userId },
      { where: { id: invite.id, acceptedAt: null }, transaction },
    );
    if (claimed !== 1) throw new HttpError(410, 'This invitation was already used.');
    const existing = await Membership.findOne({ where: { teamId: invite.teamId, userId }, transaction });
    const rank = { viewer: 1, engineer: 2, lead: 3 } as const;
    let role = invite.role;
    if (existing) {
      if (rank[existing.role] >= rank[invite.role]) role = existing.role;
      else await existing.update({ role: invite.role }, { transaction });
    } else {
      await Membership.create({ teamId: invite.teamId, userId, role: invite.role }, { transaction });
    }
    await recordAudit(
      { teamId: invite.teamId, actorId: userId, action: 'invite.accept', subjectType: 'invite', subjectId: invite.id, details: { email: invite.email, role } },
      transaction,
    );
    return { teamId: invite.teamId, teamName: invite.team.name, role };
  });
}
