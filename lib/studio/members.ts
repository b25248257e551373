import 'server-only';
import type { Transaction } from 'sequelize';
import { conflict, forbidden, notFound } from '@/lib/errors';
import { roleRank, type Role } from '@/lib/auth/roles';
import type { StudioAccess } from '@/lib/auth/actor';
import { Membership, User, sequelize } from '@/models';
import { audit } from './audit';

export type MemberView = { id: string; userId: string; name: string; email: string; role: Role; joinedAt: string };

export async function listMembers(studioId: string): Promise<MemberView[]> {
  const rows = await Membership.findAll({
    where: { studioId },
    include: [{ model: User, as: 'user', required: true }],
    order: [[{ model: User, as: 'user' }, 'name', 'ASC']],
  });
  return rows.map((m) => ({ id: m.id, userId: m.user!.id, name: m.user!.name, email: m.user!.email, role: m.role, joinedAt: m.createdAt.toISOString() }));
}

async function lockedMembership(studioId: string, membershipId: string, transaction: Transaction) {
  // Lock every admin row of the studio so two admins cannot demote each other at once.
  await sequelize.query('SELECT id FROM memberships WHERE studio_id = :studioId AND role = \'admin\' FOR UPDATE', { replacements: { studioId }, transaction });
  const membership = await Membership.findOne({ where: { id: membershipId, studioId }, transaction, lock: true });
  if (!membership) throw notFound('Member');
  return membership;
}

async function adminCount(studioId: string, transaction: Transaction): Promise<number> {
  return Membership.count({ where: { studioId, role: 'admin' }, transaction });
}

/** Changes a member's role; refuses to leave the studio without an admin. */
export async function changeRole(access: StudioAccess, actorId: string, membershipId: string, role: Role): Promise<MemberView> {
  if (roleRank(role) > roleRank(access.role)) throw forbidden('You cannot grant a role above your own.');
  await sequelize.transaction(async (transaction) => {
    const membership = await lockedMembership(access.studio.id, membershipId, transaction);
    if (membership.role === role) return;
    if (membership.role === 'admin' && (await adminCount(access.studio.id, transaction)) <= 1) {
      throw conflict('This is the studio\'s last admin; make someone else admin first.');
    }
    const from = membership.role;
    await membership.update({ role }, { transaction });
    await audit({ studioId: access.studio.id, actorId, action: 'member.role_changed', targetType: 'membership', targetId: membership.id, data: { from, to: role } }, transaction);
  });
  const member = (await listMembers(access.studio.id)).find((m) => m.id === membershipId);
  if (!member) throw notFound('Member');
  return member;
}

/** Removes a member from the studio; never the last admin. */
export async function removeMember(access: StudioAccess, actorId: string, membershipId: string): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const membership = await lockedMembership(access.studio.id, membershipId, transaction);
    if (membership.role === 'admin' && (await adminCount(access.studio.id, transaction)) <= 1) {
      throw conflict('This is the studio\'s last admin and cannot be removed; make someone else admin first.');
    }
    await membership.destroy({ transaction });
    await audit({ studioId: access.studio.id, actorId, action: 'member.removed', targetType: 'membership', targetId: membership.id, data: { userId: membership.userId, role: membership.role } }, transaction);
  });
}
