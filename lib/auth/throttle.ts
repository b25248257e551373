import 'server-only';
import { Op } from 'sequelize';
import { env } from '@/lib/env';
import { SignInThrottle, sequelize } from '@/models';

// Failed sign-ins are counted per account and per client address within a
// window; past the limit every attempt for that key is refused until the
// window ends. Successful sign-ins clear the account's count.

const windowMs = () => env.SIGN_IN_WINDOW_MINUTES * 60_000;

function keysFor(email: string, address: string) {
  return [
    { key: `account:${email.trim().toLowerCase()}`, limit: env.SIGN_IN_MAX_FAILURES_PER_ACCOUNT },
    { key: `address:${address}`, limit: env.SIGN_IN_MAX_FAILURES_PER_ADDRESS },
  ];
}

/** True when either the account or the address has used up its failures. */
export async function isThrottled(email: string, address: string, now = new Date()): Promise<boolean> {
  const keys = keysFor(email, address);
  const rows = await SignInThrottle.findAll({
    where: { key: { [Op.in]: keys.map((k) => k.key) }, windowStartedAt: { [Op.gt]: new Date(now.getTime() - windowMs()) } },
  });
  return rows.some((row) => row.failures >= keys.find((k) => k.key === row.key)!.limit);
}

/** Counts one failure against the account and the address (atomic upsert). */
export async function recordFailure(email: string, address: string, now = new Date()): Promise<void> {
  const windowStart = new Date(now.getTime() - windowMs());
  for (const { key } of keysFor(email, address)) {
    await sequelize.query(
      `INSERT INTO sign_in_throttles (key, failures, window_started_at) VALUES (:key, 1, :now)
       ON CONFLICT (key) DO UPDATE SET
         failures = CASE WHEN sign_in_throttles.window_started_at <= :windowStart THEN 1 ELSE sign_in_throttles.failures + 1 END,
         window_started_at = CASE WHEN sign_in_throttles.window_started_at <= :windowStart THEN :now ELSE sign_in_throttles.window_started_at END`,
      { replacements: { key, now, windowStart } },
    );
  }
}

export async function clearAccountFailures(email: string): Promise<void> {
  await SignInThrottle.destroy({ where: { key: `account:${email.trim().toLowerCase()}` } });
}
