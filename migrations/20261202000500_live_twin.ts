import type { Knex } from 'knex';

/**
 * The live twin: readings and predictions (partitioned by day on the slot time), the twin's
 * persisted state, simulator leases, per-loop tracking statistics, and ingest sources.
 *
 * Sample grid: slot k of a loop sits at k·T seconds after the Unix epoch (T = sample period);
 * a reading is placed in the nearest slot (jitter up to T/2).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`ALTER TABLE loops
    ADD COLUMN residual_band jsonb,
    ADD COLUMN stale_after_samples integer NOT NULL DEFAULT 5 CHECK (stale_after_samples > 0),
    ADD COLUMN maintenance boolean NOT NULL DEFAULT false`);

  await knex.raw(`CREATE TABLE readings (
    loop_id uuid NOT NULL REFERENCES loops(id) ON DELETE CASCADE,
    slot_at timestamptz NOT NULL,
    k bigint NOT NULL,
    t timestamptz NOT NULL,
    u double precision[] NOT NULL,
    y double precision[] NOT NULL,
    received_at timestamptz NOT NULL DEFAULT now(),
    source_id uuid,
    PRIMARY KEY (loop_id, slot_at)
  ) PARTITION BY RANGE (slot_at)`);

  await knex.raw(`CREATE TABLE predictions (
    loop_id uuid NOT NULL REFERENCES loops(id) ON DELETE CASCADE,
    slot_at timestamptz NOT NULL,
    k bigint NOT NULL,
    version_id uuid NOT NULL,
    x double precision[] NOT NULL,
    y double precision[] NOT NULL,
    residual double precision[],
    created_at timestamptz NOT NULL DEFAULT now(),
    PRIMARY KEY (loop_id, slot_at)
  ) PARTITION BY RANGE (slot_at)`);

  // One day per partition; created ahead by the api and the simulator (and on demand for imports).
  await knex.raw(`CREATE FUNCTION shadowloop_ensure_day_partitions(from_day date, to_day date) RETURNS integer
    LANGUAGE plpgsql AS $$
    DECLARE d date; made integer := 0; parent text; child text;
    BEGIN
      FOR d IN SELECT generate_series(from_day, to_day, interval '1 day')::date LOOP
        FOREACH parent IN ARRAY ARRAY['readings', 'predictions'] LOOP
          child := parent || '_' || to_char(d, 'YYYYMMDD');
          IF to_regclass(child) IS NULL THEN
            EXECUTE format('CREATE TABLE IF NOT EXISTS %I PARTITION OF %I FOR VALUES FROM (%L) TO (%L)',
              child, parent, d::timestamp AT TIME ZONE 'UTC', (d + 1)::timestamp AT TIME ZONE 'UTC');
            made := made + 1;
          END IF;
        END LOOP;
      END LOOP;
      RETURN made;
    END $$`);
  await knex.raw(
    `SELECT shadowloop_ensure_day_partitions((now() AT TIME ZONE 'UTC')::date - 2, (now() AT TIME ZONE 'UTC')::date + 7)`,
  );

  await knex.schema.createTable('twin_state', (t) => {
    t.uuid('loop_id').primary().references('loops.id').onDelete('CASCADE');
    t.uuid('version_id').notNullable().references('model_versions.id').onDelete('CASCADE');
    t.bigInteger('k').notNullable();
    t.specificType('x', 'double precision[]').notNullable();
    t.bigInteger('last_measured_k');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.createTable('loop_leases', (t) => {
    t.uuid('loop_id').primary().references('loops.id').onDelete('CASCADE');
    t.text('holder').notNullable();
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.index(['holder']);
  });

  await knex.schema.createTable('loop_tracking', (t) => {
    t.uuid('loop_id').primary().references('loops.id').onDelete('CASCADE');
    t.text('status').notNullable().defaultTo('no_twin');
    t.timestamp('last_reading_at', { useTz: true });
    t.timestamp('last_slot_at', { useTz: true });
    t.bigInteger('residual_count').notNullable().defaultTo(0);
    t.specificType('residual_mean', 'double precision[]');
    t.specificType('residual_m2', 'double precision[]');
    t.specificType('last_residual', 'double precision[]');
    t.double('worst_band_fraction');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`ALTER TABLE loop_tracking ADD CONSTRAINT loop_tracking_status_known
    CHECK (status IN ('in_step','drifting','diverged','stale','no_twin'))`);

  await knex.schema.createTable('ingest_sources', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('name').notNullable().unique();
    t.text('description').notNullable().defaultTo('');
    t.text('token_prefix').notNullable();
    t.text('token_hash').notNullable().unique();
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('last_used_at', { useTz: true });
    t.timestamp('revoked_at', { useTz: true });
  });
  await knex.schema.createTable('ingest_source_loops', (t) => {
    t.uuid('source_id').notNullable().references('ingest_sources.id').onDelete('CASCADE');
    t.uuid('loop_id').notNullable().references('loops.id').onDelete('CASCADE');
    t.primary(['source_id', 'loop_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of [
    'ingest_source_loops',
    'ingest_sources',
    'loop_tracking',
    'loop_leases',
    'twin_state',
    'predictions',
    'readings',
  ]) {
    await knex.schema.dropTableIfExists(table);
  }
  await knex.raw('DROP FUNCTION IF EXISTS shadowloop_ensure_day_partitions(date, date)');
  await knex.raw(
    'ALTER TABLE loops DROP COLUMN residual_band, DROP COLUMN stale_after_samples, DROP COLUMN maintenance',
  );
}
