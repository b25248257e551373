import 'server-only';
import crypto from 'node:crypto';
import bcrypt from 'bcryptjs';
import { Op } from 'sequelize';
import { appUrl, env } from '@/lib/env';
import { badRequest, conflict, forbidden, gone, notFound } from '@/lib/errors';
import { roleRank, ROLE_LABELS, type Role } from '@/lib/auth/roles';
import type { StudioAccess } from '@/lib/auth/actor';
import { sendEmail } from '@/lib/email/send';
import { Invitation, Membership, Studio, User, sequelize } from '@/models';
import { audit } from './audit';

export const PASSWORD_MIN_LENGTH = 10;

const hashToken = (token: string) => crypto.createHash('sha256').update(token).digest('hex');

export type InvitationView = { id: string; email: string; role: Role; expiresAt: string; createdAt: string; emailStatus: string | null };

export async function listPendingInvitations(studioId: string, now = new Date()): Promise<InvitationView[]> {
  const rows = await Invitation.findAll({
    where: { studioId, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: now } },
    order: [['createdAt', 'DESC']],
  });
  return rows.map((i) => ({ id: i.id, email: i.email, role: i.role, expiresAt: i.expiresAt.toISOString(), createdAt: i.createdAt.toISOString(), emailStatus: null }));
}

/**
 * Invites a person by e-mail with a role. The link holds a random token; only
 * its SHA-256 is stored, so a database leak reveals no usable link. The
 * invitation is kept even if the e-mail fails; the result says so.
 */
export async function invite(access: StudioAccess, actor: { userId: string; name: string }, email: string, role: Role, now = new Date()) {
  if (roleRank(role) > roleRank(access.role)) throw forbidden('You cannot invite someone to a role above your own.');
  const existing = await User.findOne({ where: { email } });
  if (existing && (await Membership.findOne({ where: { studioId: access.studio.id, userId: existing.id } }))) {
    throw conflict(`${email} is already a member of this studio; change their role instead.`);
  }
  const token = crypto.randomBytes(32).toString('base64url');
  const invitation = await sequelize.transaction(async (transaction) => {
    // A new invitation replaces any still-open one for the same address.
    await Invitation.update({ revokedAt: now }, { where: { studioId: access.studio.id, email, acceptedAt: null, revokedAt: null }, transaction });
    const created = await Invitation.create(
      { studioId: access.studio.id, invitedById: actor.userId, email, role, tokenHash: hashToken(token), expiresAt: new Date(now.getTime() + env.INVITATION_TTL_HOURS * 3_600_000), acceptedAt: null, revokedAt: null },
      { transaction },
    );
    await audit({ studioId: access.studio.id, actorId: actor.userId, action: 'member.invited', targetType: 'invitation', targetId: created.id, data: { email, role } }, transaction);
    return created;
  });

  const link = `${appUrl}/invitations/${token}`;
  const text = [
    `${actor.name} has invited you to join the studio "${access.studio.name}" on Skywell as ${ROLE_LABELS[role].toLowerCase()}.`,
    '',
    `Set your password and join: ${link}`,
    '',
    `The link works once and expires on ${invitation.expiresAt.toUTCString()}.`,
    'If you did not expect this invitation, ignore this e-mail.',
  ].join('\n');
  const message = await sendEmail({ studioId: access.studio.id, kind: 'invitation', to: email, subject: `Join ${access.studio.name} on Skywell`, text });
  return {
    invitation: { id: invitation.id, email, role, expiresAt: invitation.expiresAt.toISOString(), createdAt: invitation.createdAt.toISOString(), emailStatus: message.status },
    emailError: message.status === 'failed' ? message.error : null,
  };
}

export type InvitationState =
  | { state: 'open'; studioName: string; email: string; role: Role; needsPassword: boolean }
  | { state: 'expired' | 'used' | 'unknown' };

async function findByToken(token: string) {
  return Invitation.findOne({ where: { tokenHash: hashToken(token) }, include: [{ model: Studio, as: 'studio', required: true }] });
}

/** What the invitation page should show for a token; changes nothing. */
export async function invitationState(token: string, now = new Date()): Promise<InvitationState> {
  const invitation = await findByToken(token);
  if (!invitation) return { state: 'unknown' };
  if (invitation.acceptedAt || invitation.revokedAt) return { state: 'used' };
  if (invitation.expiresAt <= now) return { state: 'expired' };
  const user = await User.findOne({ where: { email: invitation.email } });
  return { state: 'open', studioName: invitation.studio!.name, email: invitation.email, role: invitation.role, needsPassword: !user?.passwordHash };
}

/**
 * Accepts an invitation: creates the account (or uses the existing one), sets
 * the password if the person has none, and adds the membership, all in one
 * transaction. A used, revoked or expired link changes nothing.
 */
export async function acceptInvitation(input: { token: string; name?: string; password?: string }, now = new Date()) {
  return sequelize.transaction(async (transaction) => {
    const invitation = await Invitation.findOne({ where: { tokenHash: hashToken(input.token) }, transaction, lock: true });
    if (!invitation) throw notFound('Invitation');
    if (invitation.acceptedAt || invitation.revokedAt) throw gone('This invitation link has already been used or was replaced; ask the studio admin for a new one.');
    if (invitation.expiresAt <= now) throw gone('This invitation link has expired; ask the studio admin for a new one.');

    let user = await User.findOne({ where: { email: invitation.email }, transaction });
    if (!user?.passwordHash) {
      if (!input.password || input.password.length < PASSWORD_MIN_LENGTH) {
        throw badRequest(`Choose a password of at least ${PASSWORD_MIN_LENGTH} characters.`, { errors: [{ field: 'password', message: `At least ${PASSWORD_MIN_LENGTH} characters.` }] });
      }
      if (!user && !input.name?.trim()) throw badRequest('Enter your name.', { errors: [{ field: 'name', message: 'Enter your name.' }] });
      const passwordHash = await bcrypt.hash(input.password, 10);
      if (user) await user.update({ passwordHash }, { transaction });
      else user = await User.create({ email: invitation.email, name: input.name!.trim(), passwordHash }, { transaction });
    }
    const [membership, created] = await Membership.findOrCreate({
      where: { studioId: invitation.studioId, userId: user.id },
      defaults: { studioId: invitation.studioId, userId: user.id, role: invitation.role },
      transaction,
    });
    await invitation.update({ acceptedAt: now }, { transaction });
    await audit({ studioId: invitation.studioId, actorId: user.id, action: 'member.joined', targetType: 'membership', targetId: membership.id, data: { role: membership.role, viaInvitation: invitation.id, alreadyMember: !created } }, transaction);
    return { email: user.email };
  });
}
