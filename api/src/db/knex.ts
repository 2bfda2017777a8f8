import knexFactory, { type Knex } from 'knex';

export type Db = Knex;

/** One knex instance per process. */
export function createDb(databaseUrl: string, poolMax = 10): Db {
  return knexFactory({ client: 'pg', connection: databaseUrl, pool: { min: 0, max: poolMax } });
}
