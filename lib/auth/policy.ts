import type { Role } from './roles';

/**
 * Who may do what inside a studio: the single table every route handler,
 * server action and page consults through `authorize`. Non-members never
 * reach this table: they get 404 before it.
 */
export const POLICY = {
  'studio.read': ['admin', 'producer', 'advisor', 'operator'],
  'members.read': ['admin'],
  'members.invite': ['admin'],
  'members.update': ['admin'],
  'members.remove': ['admin'],
  'emails.read': ['admin'],
  'audit.read': ['admin'],
  'shows.read': ['admin', 'producer', 'advisor', 'operator'],
  'shows.write': ['admin', 'producer'],
  // Operators will read approved scenes once approvals exist (Reviews); until then scenes are closed to them.
  'scenes.read': ['admin', 'producer', 'advisor'],
  'scenes.write': ['admin', 'producer'],
  'renders.read': ['admin', 'producer', 'advisor'],
  'renders.create': ['admin', 'producer'],
  'deliveries.read': ['admin', 'producer', 'advisor', 'operator'],
  'deliveries.mark-loaded': ['admin', 'operator'],
  'reviews.read': ['admin', 'producer', 'advisor'],
  'reviews.submit': ['admin', 'producer'],
  // Producers and admins reply in threads; only advisors pin new notes (checked in lib/reviews).
  'reviews.comment': ['admin', 'producer', 'advisor'],
  'reviews.decide': ['advisor'],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof POLICY;

export function roleMay(role: Role, action: Action): boolean {
  return (POLICY[action] as readonly Role[]).includes(role);
}
