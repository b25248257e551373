import 'server-only';
import path from 'node:path';
import { createRequire } from 'node:module';
import { pathToFileURL } from 'node:url';
import { Sequelize } from 'sequelize';
import { Umzug, SequelizeStorage } from 'umzug';
import { sequelize } from './connection';

type Step = { up: (p: { context: StepContext }) => Promise<void>; down?: (p: { context: StepContext }) => Promise<void> };
type StepContext = { queryInterface: ReturnType<typeof sequelize.getQueryInterface>; Sequelize: typeof Sequelize };

const requireCjs = createRequire(import.meta.url);

async function loadStep(file: string): Promise<Step> {
  // Migrations are CommonJS (.js); seeders are TypeScript modules using the models.
  const loaded = file.endsWith('.js') ? requireCjs(file) : await import(pathToFileURL(file).href);
  return (loaded.default?.up ? loaded.default : loaded) as Step;
}

function makeUmzug(folder: 'migrations' | 'seeders', tableName: string) {
  const context: StepContext = { queryInterface: sequelize.getQueryInterface(), Sequelize };
  return new Umzug<StepContext>({
    migrations: {
      glob: [`${folder}/*.{js,ts}`, { cwd: process.cwd() }],
      resolve: ({ name, path: file }) => ({
        name,
        up: async ({ context: ctx }) => (await loadStep(path.resolve(file!))).up({ context: ctx }),
        down: async ({ context: ctx }) => {
          const step = await loadStep(path.resolve(file!));
          if (!step.down) throw new Error(`${name} cannot be rolled back: it has no down()`);
          await step.down({ context: ctx });
        },
      }),
    },
    context,
    storage: new SequelizeStorage({ sequelize, tableName }),
    logger: undefined,
  });
}

/** Applies every pending migration; returns the names applied. Never drops anything. */
export async function migrate(): Promise<string[]> {
  const applied = await makeUmzug('migrations', 'schema_migrations').up();
  return applied.map((m) => m.name);
}

/** Rolls back the newest migration. */
export async function rollback(): Promise<string[]> {
  const reverted = await makeUmzug('migrations', 'schema_migrations').down();
  return reverted.map((m) => m.name);
}

/** Runs seeders not yet run; each seeder is itself idempotent. */
export async function seed(): Promise<string[]> {
  const applied = await makeUmzug('seeders', 'schema_seeds').up();
  return applied.map((m) => m.name);
}
