import type { Role } from '@/lib/auth/roles';

/** The invented demo studio from product.md ("Saltmarsh Dome", show "The Long Fall"). */
export const DEMO_STUDIO = { name: 'Saltmarsh Dome', slug: 'saltmarsh-dome' } as const;

/** One demo account per role, at the reserved .test domain (RFC 2606). */
export const DEMO_ACCOUNTS: ReadonlyArray<{ email: string; name: string; role: Role }> = [
  { email: 'admin@saltmarsh-dome.test', name: 'Maren Okafor', role: 'admin' },
  { email: 'producer@saltmarsh-dome.test', name: 'Tomas Lindqvist', role: 'producer' },
  { email: 'advisor@saltmarsh-dome.test', name: 'Ines Halvorsen', role: 'advisor' },
  { email: 'operator@saltmarsh-dome.test', name: 'Kofi Brandt', role: 'operator' },
];
