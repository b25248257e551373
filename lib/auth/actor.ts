import 'server-only';
import { getToken } from 'next-auth/jwt';
import { getServerSession } from 'next-auth';
import { env } from '@/lib/env';
import { forbidden, notFound } from '@/lib/errors';
import { Membership, Studio, User } from '@/models';
import { authOptions } from './options';
import { roleMay, type Action } from './policy';
import type { Role } from './roles';

export type Actor = { userId: string; email: string; name: string };
export type StudioAccess = { studio: Studio; role: Role; membershipId: string };

function parseCookies(header: string | null): Record<string, string> {
  const cookies: Record<string, string> = {};
  for (const part of (header ?? '').split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0) cookies[part.slice(0, eq).trim()] = decodeURIComponent(part.slice(eq + 1).trim());
  }
  return cookies;
}

async function actorFromUserId(userId: string | undefined): Promise<Actor | null> {
  if (!userId) return null;
  const user = await User.findByPk(userId);
  return user ? { userId: user.id, email: user.email, name: user.name } : null;
}

/** The signed-in person behind an API request (session cookie), or null. */
export async function actorFromRequest(request: Request): Promise<Actor | null> {
  const token = await getToken({
    req: { headers: Object.fromEntries(request.headers), cookies: parseCookies(request.headers.get('cookie')) } as never,
    secret: env.NEXTAUTH_SECRET,
  });
  return actorFromUserId(token?.userId);
}

/** The signed-in person for a server component or server action, or null. */
export async function actorFromSession(): Promise<Actor | null> {
  const session = await getServerSession(authOptions);
  return actorFromUserId(session?.user?.id);
}

/**
 * The one decision "may this person do this in this studio". A person outside
 * the studio gets 404 (the studio's existence is not revealed); a member whose
 * role is too low gets 403.
 */
export async function authorize(actor: Actor, studioSlug: string, action: Action): Promise<StudioAccess> {
  const studio = await Studio.findOne({ where: { slug: studioSlug } });
  const membership = studio ? await Membership.findOne({ where: { studioId: studio.id, userId: actor.userId } }) : null;
  if (!studio || !membership) throw notFound('Studio');
  if (!roleMay(membership.role, action)) {
    throw forbidden(`Your role (${membership.role}) cannot do this here; ask a studio admin.`);
  }
  return { studio, role: membership.role, membershipId: membership.id };
}
