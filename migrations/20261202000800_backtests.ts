import type { Knex } from 'knex';

/**
 * Backtests: model versions of a loop replayed over recorded data as background jobs, the samples of
 * uploaded recordings (kept apart from the live readings), and backtests attached to a version as
 * evidence for its review.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('backtests', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('loop_id').notNullable().references('loops.id').onDelete('CASCADE');
    t.text('status').notNullable().defaultTo('queued');
    /** 0 … 1, and what the job does now in words. */
    t.double('progress').notNullable().defaultTo(0);
    t.text('stage').notNullable().defaultTo('waiting for a worker');
    /** The versions in the order they were asked for. */
    t.specificType('version_ids', 'uuid[]').notNullable();
    t.text('source').notNullable();
    /** source = range: the stored readings with from ≤ slot time < to. */
    t.timestamp('range_from', { useTz: true });
    t.timestamp('range_to', { useTz: true });
    /** source = upload: the file's tally (fileName, rowsRead, accepted, duplicates, rejected, badRows). */
    t.jsonb('upload');
    t.boolean('cancel_requested').notNullable().defaultTo(false);
    t.jsonb('results');
    t.text('error');
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('started_at', { useTz: true });
    t.timestamp('finished_at', { useTz: true });
    /** The api process running it, and its newest sign of life: a silent job is re-queued. */
    t.text('claimed_by');
    t.timestamp('heartbeat_at', { useTz: true });
    t.integer('attempts').notNullable().defaultTo(0);
    t.index(['loop_id', 'created_at']);
  });
  await knex.raw(`ALTER TABLE backtests
    ADD CONSTRAINT backtests_status_known CHECK (status IN ('queued','running','succeeded','failed','cancelled')),
    ADD CONSTRAINT backtests_source_known CHECK (source IN ('range','upload')),
    ADD CONSTRAINT backtests_source_fields CHECK (
      (source = 'range' AND range_from IS NOT NULL AND range_to > range_from) OR (source = 'upload' AND upload IS NOT NULL)),
    ADD CONSTRAINT backtests_progress_fraction CHECK (progress BETWEEN 0 AND 1),
    ADD CONSTRAINT backtests_results_when_succeeded CHECK ((status = 'succeeded') = (results IS NOT NULL))`);
  // the workers' queue: the oldest queued job first, and running jobs whose heartbeat went silent
  await knex.raw(`CREATE INDEX backtests_waiting ON backtests (created_at) WHERE status IN ('queued', 'running')`);

  // An uploaded recording: one row per slot, the first row of a slot kept.
  await knex.raw(`CREATE TABLE backtest_samples (
    backtest_id uuid NOT NULL REFERENCES backtests(id) ON DELETE CASCADE,
    k bigint NOT NULL,
    u double precision[] NOT NULL,
    y double precision[] NOT NULL,
    PRIMARY KEY (backtest_id, k)
  )`);

  await knex.schema.createTable('model_version_evidence', (t) => {
    t.uuid('version_id').notNullable().references('model_versions.id').onDelete('CASCADE');
    t.uuid('backtest_id').notNullable().references('backtests.id').onDelete('CASCADE');
    t.text('note');
    t.uuid('attached_by').references('users.id').onDelete('SET NULL');
    t.timestamp('attached_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['version_id', 'backtest_id']);
    t.index(['backtest_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('model_version_evidence');
  await knex.schema.dropTableIfExists('backtest_samples');
  await knex.schema.dropTableIfExists('backtests');
}
