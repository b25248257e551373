import crypto from 'node:crypto';
import bcrypt from 'bcryptjs';
import { encode } from 'next-auth/jwt';
import { env } from '@/lib/env';
import type { Role } from '@/lib/auth/roles';
import { Membership, Studio, User } from '@/models';

// Tests build their own data; every name is unique so tests never collide.
const unique = () => crypto.randomBytes(4).toString('hex');

export const TEST_PASSWORD = 'correct-horse-battery';
let cachedHash: string | undefined;

export async function makeStudio(name = 'Test Dome') {
  const suffix = unique();
  return Studio.create({ name: `${name} ${suffix}`, slug: `test-${suffix}` });
}

export async function makeUser(overrides: Partial<{ email: string; name: string; password: string | null }> = {}) {
  cachedHash ??= await bcrypt.hash(TEST_PASSWORD, 4);
  const password = overrides.password === undefined ? TEST_PASSWORD : overrides.password;
  return User.create({
    email: overrides.email ?? `person-${unique()}@example.test`,
    name: overrides.name ?? 'Test Person',
    passwordHash: password === null ? null : password === TEST_PASSWORD ? cachedHash : await bcrypt.hash(password, 4),
  });
}

export async function makeMember(studio: Studio, role: Role) {
  const user = await makeUser({ name: `Test ${role}` });
  const membership = await Membership.create({ studioId: studio.id, userId: user.id, role });
  return { user, membership };
}

/** A studio with one member per role plus a person from another studio. */
export async function makeStudioWithCast() {
  const studio = await makeStudio();
  const cast = {
    admin: await makeMember(studio, 'admin'),
    producer: await makeMember(studio, 'producer'),
    advisor: await makeMember(studio, 'advisor'),
    operator: await makeMember(studio, 'operator'),
  };
  const otherStudio = await makeStudio('Other Dome');
  const foreigner = await makeMember(otherStudio, 'admin');
  return { studio, cast, otherStudio, foreigner };
}

/** The session cookie next-auth would set after signing this person in. */
export async function sessionCookie(user: User): Promise<string> {
  const token = await encode({ token: { userId: user.id, email: user.email, name: user.name, sub: user.id }, secret: env.NEXTAUTH_SECRET });
  return `next-auth.session-token=${token}`;
}
