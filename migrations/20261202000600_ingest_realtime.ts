import type { Knex } from 'knex';

/**
 * What the ingest and realtime need beyond the live-twin schema: the socket.io postgres adapter's
 * table for large or binary broadcasts, progress of historical CSV imports, the lookup of a loop's
 * ingest sources, and the per-minute extremes that long trends read.
 */
export async function up(knex: Knex): Promise<void> {
  // The adapter (@socket.io/postgres-adapter) writes payloads over the NOTIFY limit here and prunes them.
  await knex.raw(`CREATE TABLE socket_io_attachments (
    id bigserial UNIQUE,
    created_at timestamptz DEFAULT now(),
    payload bytea
  )`);

  await knex.schema.createTable('reading_imports', (t) => {
    t.uuid('id').primary();
    t.uuid('loop_id').notNullable().references('loops.id').onDelete('CASCADE');
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.text('file_name').notNullable();
    t.bigInteger('rows_read').notNullable().defaultTo(0);
    t.bigInteger('accepted').notNullable().defaultTo(0);
    t.bigInteger('duplicates').notNullable().defaultTo(0);
    t.bigInteger('rejected').notNullable().defaultTo(0);
    t.jsonb('bad_rows').notNullable().defaultTo('[]');
    t.boolean('done').notNullable().defaultTo(false);
    t.text('error');
    t.timestamp('started_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('finished_at', { useTz: true });
    t.index(['loop_id', 'started_at']);
  });

  await knex.raw('CREATE INDEX ingest_source_loops_loop_id ON ingest_source_loops (loop_id)');

  // Per-minute extremes of settled minutes, kept the first time a long trend asks for them.
  // a = y (measured or predicted), b = u (readings) or residual (predictions).
  await knex.raw(`CREATE TABLE trend_minutes (
    loop_id uuid NOT NULL REFERENCES loops(id) ON DELETE CASCADE,
    source text NOT NULL CHECK (source IN ('readings', 'predictions')),
    minute_at timestamptz NOT NULL,
    samples integer NOT NULL,
    first_at timestamptz,
    last_at timestamptz,
    a_min double precision[], a_max double precision[], b_min double precision[], b_max double precision[],
    PRIMARY KEY (loop_id, source, minute_at)
  )`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('trend_minutes');
  await knex.raw('DROP INDEX IF EXISTS ingest_source_loops_loop_id');
  await knex.schema.dropTableIfExists('reading_imports');
  await knex.schema.dropTableIfExists('socket_io_attachments');
}
