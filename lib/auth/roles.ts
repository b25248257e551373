/** Studio roles from product.md, lowest to highest reach for management. */
export const ROLES = ['operator', 'advisor', 'producer', 'admin'] as const;
export type Role = (typeof ROLES)[number];

/** Rank used to stop anyone granting a role above their own. */
export function roleRank(role: Role): number {
  return ROLES.indexOf(role);
}

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  producer: 'Producer',
  advisor: 'Scientific advisor',
  operator: 'Show operator',
};
