import { fileURLToPath } from 'node:url';
import path from 'node:path';
import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface, Sequelize } from 'sequelize';

const migrationsDir = path.resolve(fileURLToPath(new URL('.', import.meta.url)), '../../migrations');

export type MigrationContext = { queryInterface: QueryInterface; sequelize: Sequelize };
export type Migration = (params: { context: MigrationContext }) => Promise<void>;

export function createMigrator(sequelize: Sequelize) {
  return new Umzug<MigrationContext>({
    migrations: {
      glob: ['*.ts', { cwd: migrationsDir }],
      // Imported from here (not inside umzug) so that tsx or Vite's runner loads the TypeScript.
      resolve: ({ name, path: file, context }) => ({
        name,
        up: async () => (await import(file!)).up({ context }),
        down: async () => (await import(file!)).down({ context }),
      }),
    },
    context: { queryInterface: sequelize.getQueryInterface(), sequelize },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

export async function migrate(sequelize: Sequelize): Promise<string[]> {
  const applied = await createMigrator(sequelize).up();
  return applied.map((migration) => migration.name);
}
