// Database chores for the orchestrator and for developers:
//   migrate | rollback | seed | reset-test
import { Sequelize } from 'sequelize';
import { env } from '@/lib/env';
import { sequelize } from '@/lib/db/connection';
import { migrate, rollback, seed } from '@/lib/db/migrator';
import { DEMO_ACCOUNTS } from '@/lib/demo/accounts';

async function resetTestDatabase(): Promise<void> {
  const url = new URL(env.DATABASE_URL);
  const database = url.pathname.slice(1);
  if (!database.endsWith('_test')) {
    throw new Error(`refusing to reset '${database}': only databases whose name ends in _test are reset`);
  }
  url.pathname = '/postgres';
  const admin = new Sequelize(url.toString(), { dialect: 'postgres', logging: false });
  await admin.query(`DROP DATABASE IF EXISTS "${database}" WITH (FORCE)`);
  await admin.query(`CREATE DATABASE "${database}"`);
  await admin.close();
}

async function main(): Promise<void> {
  const command = process.argv[2];
  if (command === 'reset-test') {
    await resetTestDatabase();
    console.log('[skywell] test database emptied');
  } else if (command === 'migrate') {
    const applied = await migrate();
    console.log(`[skywell] migrations: ${applied.length ? applied.join(', ') : 'up to date'}`);
  } else if (command === 'rollback') {
    const reverted = await rollback();
    console.log(`[skywell] rolled back: ${reverted.join(', ') || 'nothing'}`);
  } else if (command === 'seed') {
    const applied = await seed();
    console.log(`[skywell] seeders: ${applied.length ? applied.join(', ') : 'up to date'}`);
    console.log('[skywell] demo accounts (password for each: the SKYWELL_DEMO_PASSWORD set when first seeded; default skywell-demo-2026):');
    for (const account of DEMO_ACCOUNTS) console.log(`[skywell]   ${account.role.padEnd(9)} ${account.email}`);
  } else {
    throw new Error(`unknown command '${command}': use migrate, rollback, seed or reset-test`);
  }
}

main()
  .then(() => sequelize.close())
  .catch(async (error: unknown) => {
    console.error(`[skywell] ${error instanceof Error ? error.message : String(error)}`);
    await sequelize.close();
    process.exit(1);
  });
