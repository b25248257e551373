import { env } from '@/lib/env';
import { sequelize } from '@/models';

/**
 * Integration tests run only against a database whose name ends in _test
 * (the one `npm test` creates), never against development data.
 */
export function assertTestDatabase(): void {
  const name = new URL(env.DATABASE_URL).pathname.slice(1);
  if (!name.endsWith('_test')) {
    throw new Error(`integration tests refuse to run against '${name}': run them through 'npm test', which starts the test cluster`);
  }
}

export async function closeDatabase(): Promise<void> {
  await sequelize.close();
}
