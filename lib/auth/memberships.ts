import 'server-only';
import { Membership, Studio } from '@/models';
import type { Role } from './roles';

export type StudioMembership = { studioId: string; slug: string; name: string; role: Role };

/** The person's studios and roles, fresh from the database. */
export async function membershipsOf(userId: string): Promise<StudioMembership[]> {
  const rows = await Membership.findAll({
    where: { userId },
    include: [{ model: Studio, as: 'studio', required: true }],
    order: [[{ model: Studio, as: 'studio' }, 'name', 'ASC']],
  });
  return rows.map((m) => ({ studioId: m.studio!.id, slug: m.studio!.slug, name: m.studio!.name, role: m.role }));
}
