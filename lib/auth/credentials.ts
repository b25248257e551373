import 'server-only';
import bcrypt from 'bcryptjs';
import { z } from 'zod';
import { User } from '@/models';
import { clearAccountFailures, isThrottled, recordFailure } from './throttle';

export const signInSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter the e-mail address you were invited with.'),
  password: z.string().min(1, 'Enter your password.').max(200),
});

export type SignInResult =
  | { ok: true; user: { id: string; email: string; name: string } }
  | { ok: false; reason: 'invalid' | 'throttled' };

// Compared against when the account does not exist, so timing does not reveal it.
const DUMMY_HASH = '$2b$10$0P3NYlLGLbuv9Ezc/M7TjOfrb943WKQn1luAdIe4ZuK7ufqIqUTFS';

/** Checks an e-mail and password; the caller learns only "valid", "invalid" or "throttled". */
export async function verifyCredentials(input: unknown, address: string): Promise<SignInResult> {
  const parsed = signInSchema.safeParse(input);
  if (!parsed.success) return { ok: false, reason: 'invalid' };
  const { email, password } = parsed.data;
  if (await isThrottled(email, address)) return { ok: false, reason: 'throttled' };

  const user = await User.findOne({ where: { email } });
  const matches = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH);
  if (!user || !user.passwordHash || !matches) {
    await recordFailure(email, address);
    return { ok: false, reason: 'invalid' };
  }
  await clearAccountFailures(email);
  return { ok: true, user: { id: user.id, email: user.email, name: user.name } };
}
