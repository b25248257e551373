import type { Role } from './roles';

export type NavItem = { label: string; segment: string; roles: readonly Role[]; available: boolean; purpose: string };

/**
 * The studio navigation from product.md. `available` is false for sections
 * whose pages have not been built yet; they are shown as such, not linked.
 */
export const NAV_ITEMS: readonly NavItem[] = [
  { label: 'Shows', segment: 'shows', roles: ['admin', 'producer', 'advisor', 'operator'], available: true, purpose: 'Shows and their scenes' },
  { label: 'Reviews', segment: 'reviews', roles: ['admin', 'producer', 'advisor'], available: true, purpose: 'Scene revisions awaiting an advisor' },
  { label: 'Renders', segment: 'renders', roles: ['admin', 'producer', 'advisor'], available: true, purpose: 'Stills and frame sequences in progress' },
  { label: 'Deliveries', segment: 'deliveries', roles: ['admin', 'producer', 'advisor', 'operator'], available: true, purpose: 'Frame packages for show operators' },
  { label: 'Sky view', segment: 'sky-view', roles: ['admin', 'producer', 'advisor'], available: true, purpose: 'Live lensed sky for framing and inspection (WebGL, CPU fallback)' },
  { label: 'Library', segment: 'library', roles: ['admin', 'producer', 'advisor'], available: false, purpose: 'Sky panoramas and star catalogues' },
  { label: 'Studio', segment: 'studio', roles: ['admin'], available: true, purpose: 'Members, invitations and sent e-mail' },
];

export function navigationFor(role: Role): NavItem[] {
  return NAV_ITEMS.filter((item) => item.roles.includes(role));
}
