import knexFactory from 'knex';
import pg from 'pg';
import { knexConfig } from '../../knexfile.js';

/** Creates the database when it does not exist yet. */
export async function ensureDatabase(adminUrl: string, name: string): Promise<void> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    const found = await client.query('SELECT 1 FROM pg_database WHERE datname = $1', [name]);
    if (found.rowCount === 0) await client.query(`CREATE DATABASE "${name}"`);
  } finally {
    await client.end();
  }
}

/** Drops a throwaway database, closing any connection still open to it. */
export async function dropDatabase(adminUrl: string, name: string): Promise<void> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
  } finally {
    await client.end();
  }
}

/** Brings the schema up to date and runs the (idempotent) demo seeds. */
export async function migrateAndSeed(databaseUrl: string, options: { seed: boolean }): Promise<string[]> {
  const knex = knexFactory(knexConfig(databaseUrl));
  try {
    const [, applied] = (await knex.migrate.latest()) as [number, string[]];
    if (options.seed) await knex.seed.run();
    return applied;
  } finally {
    await knex.destroy();
  }
}

/** Replaces the database name in a PostgreSQL URL. */
export function withDatabase(url: string, database: string): string {
  const parsed = new URL(url);
  parsed.pathname = `/${database}`;
  return parsed.toString();
}
