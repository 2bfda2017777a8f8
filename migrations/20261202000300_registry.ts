import type { Knex } from 'knex';

const STATUSES = ['draft', 'in_review', 'approved', 'active', 'retired', 'rejected'];

/** Plant areas, loops and their model versions (the registry). */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('areas', (t) => {
    t.text('id').primary();
    t.text('name').notNullable();
    t.integer('sort_order').notNullable().defaultTo(0);
  });

  await knex.schema.createTable('loops', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('tag').notNullable().unique();
    t.text('name').notNullable();
    t.text('area_id').notNullable().references('areas.id');
    t.text('description').notNullable().defaultTo('');
    t.double('sample_period_s').notNullable();
    t.jsonb('inputs').notNullable();
    t.jsonb('states').notNullable();
    t.jsonb('outputs').notNullable();
    t.jsonb('operating_point').notNullable().defaultTo('{}');
    t.text('time_zone').notNullable().defaultTo('UTC');
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['area_id']);
  });
  await knex.raw('ALTER TABLE loops ADD CONSTRAINT loops_sample_period_positive CHECK (sample_period_s > 0)');

  await createModelVersions(knex);
  // A loop's log lists the entries of its model versions too; they carry the loop's id in details.
  await knex.raw(`CREATE INDEX audit_log_loop_id ON audit_log ((details->>'loopId'))`);
}

async function createModelVersions(knex: Knex): Promise<void> {
  await knex.schema.createTable('model_versions', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('loop_id').notNullable().references('loops.id').onDelete('CASCADE');
    t.integer('number').notNullable();
    t.text('status').notNullable().defaultTo('draft');
    t.double('sample_period_s').notNullable();
    for (const matrix of ['a', 'b']) t.jsonb(matrix).notNullable();
    for (const matrix of ['c', 'd', 'continuous']) t.jsonb(matrix);
    t.jsonb('correction').notNullable();
    t.text('change_note').notNullable();
    t.text('justification');
    t.jsonb('analysis').notNullable();
    t.uuid('author_id').references('users.id').onDelete('SET NULL');
    t.uuid('reviewer_id').references('users.id').onDelete('SET NULL');
    t.uuid('activated_by').references('users.id').onDelete('SET NULL');
    // The version that was active when this one was approved: activation is refused once it changed.
    t.uuid('approved_against_version_id').references('model_versions.id').onDelete('SET NULL');
    t.text('review_note');
    t.text('reject_reason');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    for (const at of ['submitted_at', 'reviewed_at', 'activated_at', 'retired_at']) t.timestamp(at, { useTz: true });
    t.unique(['loop_id', 'number']);
  });
  await knex.raw(`ALTER TABLE model_versions ADD CONSTRAINT model_versions_status_known
    CHECK (status IN (${STATUSES.map((s) => `'${s}'`).join(',')}))`);
  await knex.raw(`ALTER TABLE model_versions ADD CONSTRAINT model_versions_four_eyes
    CHECK (reviewer_id IS NULL OR reviewer_id IS DISTINCT FROM author_id)`);
  await knex.raw(`CREATE UNIQUE INDEX model_versions_one_active ON model_versions (loop_id) WHERE status = 'active'`);
  await knex.raw(`CREATE FUNCTION model_versions_keep_matrices() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF (NEW.a, NEW.b, NEW.c, NEW.d, NEW.continuous, NEW.correction, NEW.change_note, NEW.sample_period_s)
         IS DISTINCT FROM (OLD.a, OLD.b, OLD.c, OLD.d, OLD.continuous, OLD.correction, OLD.change_note, OLD.sample_period_s) THEN
        RAISE EXCEPTION 'the matrices of a model version never change; create a new draft';
      END IF;
      RETURN NEW;
    END $$`);
  await knex.raw(`CREATE TRIGGER model_versions_immutable BEFORE UPDATE ON model_versions
    FOR EACH ROW EXECUTE FUNCTION model_versions_keep_matrices()`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('DROP INDEX IF EXISTS audit_log_loop_id');
  await knex.schema.dropTableIfExists('model_versions');
  await knex.raw('DROP FUNCTION IF EXISTS model_versions_keep_matrices()');
  await knex.schema.dropTableIfExists('loops');
  await knex.schema.dropTableIfExists('areas');
}
