import type { StudioMembership } from '@/lib/auth/memberships';

declare module 'next-auth' {
  interface Session {
    user: { id: string; email: string; name: string; memberships: StudioMembership[] };
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    userId: string;
    memberships?: StudioMembership[];
  }
}
