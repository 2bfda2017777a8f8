import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { Knex } from 'knex';

const root = path.dirname(fileURLToPath(import.meta.url));
const migrationsDir = path.join(root, 'migrations');
const seedsDir = path.join(root, 'seeds');
const tsFiles = (dir: string) =>
  fs
    .readdirSync(dir)
    .filter((f) => f.endsWith('.ts'))
    .sort();
// Loaded through this module's own import() so that tsx and vitest both transpile them.
const load = (file: string) => import(pathToFileURL(file).href);

const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () => tsFiles(migrationsDir),
  getMigrationName: (name) => name,
  getMigration: (name) => load(path.join(migrationsDir, name)),
};

const seedSource = {
  getSeeds: async () => tsFiles(seedsDir).map((f) => path.join(seedsDir, f)),
  getSeed: (file: string) => load(file),
  _getConfigDirectories: () => [seedsDir],
};

/** Knex settings shared by the start script, the test set-up and the admin command. */
export function knexConfig(databaseUrl: string): Knex.Config {
  return {
    client: 'pg',
    connection: databaseUrl,
    pool: { min: 0, max: 5 },
    migrations: { migrationSource, tableName: 'knex_migrations' },
    seeds: { seedSource } as Knex.SeederConfig,
  };
}

export default knexConfig(process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:5433/shadowloop');
