import type { Knex } from 'knex';

/**
 * Divergence alerts: drift rules (versioned), their running state beside the loop's tracking,
 * alerts with their timeline, suppressed raises, the on-call rota, alert settings, the mail outbox
 * and one-click acknowledge links.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('drift_rules', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('loop_id').notNullable().references('loops.id').onDelete('CASCADE');
    t.text('kind').notNullable();
    t.boolean('enabled').notNullable().defaultTo(true);
    t.smallint('priority').notNullable();
    t.jsonb('params').notNullable();
    t.integer('version').notNullable().defaultTo(1);
    t.uuid('updated_by').references('users.id').onDelete('SET NULL');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['loop_id', 'kind']);
  });
  await knex.raw(`ALTER TABLE drift_rules
    ADD CONSTRAINT drift_rules_kind_known CHECK (kind IN ('band','cusum','nis','stale')),
    ADD CONSTRAINT drift_rules_priority_range CHECK (priority BETWEEN 1 AND 3)`);

  // Every saved form of a rule, the first included: what was in force when an alert was raised.
  await knex.schema.createTable('drift_rule_versions', (t) => {
    t.uuid('rule_id').notNullable().references('drift_rules.id').onDelete('CASCADE');
    t.integer('version').notNullable();
    t.boolean('enabled').notNullable();
    t.smallint('priority').notNullable();
    t.jsonb('params').notNullable();
    t.text('note').notNullable().defaultTo('');
    t.uuid('changed_by').references('users.id').onDelete('SET NULL');
    t.timestamp('changed_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['rule_id', 'version']);
  });

  // Per rule id: its detectors' running state (counters, CUSUM sums, raised or not).
  await knex.raw(`ALTER TABLE loop_tracking ADD COLUMN rule_state jsonb NOT NULL DEFAULT '{}'::jsonb`);

  await knex.schema.createTable('alerts', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.specificType('number', 'bigint GENERATED ALWAYS AS IDENTITY').unique();
    t.uuid('loop_id').notNullable().references('loops.id').onDelete('CASCADE');
    t.text('area_id').notNullable().references('areas.id');
    t.uuid('rule_id').references('drift_rules.id').onDelete('SET NULL');
    t.text('rule_kind').notNullable();
    t.integer('rule_version');
    t.uuid('version_id').references('model_versions.id').onDelete('SET NULL');
    t.smallint('priority').notNullable();
    t.text('state').notNullable().defaultTo('unacknowledged');
    /** The condition is present now (raised and not yet cleared). */
    t.boolean('active').notNullable().defaultTo(true);
    t.timestamp('raised_at', { useTz: true }).notNullable();
    t.timestamp('cleared_at', { useTz: true });
    t.integer('activations').notNullable().defaultTo(1);
    t.timestamp('acknowledged_at', { useTz: true });
    t.uuid('acknowledged_by').references('users.id').onDelete('SET NULL');
    t.timestamp('shelved_until', { useTz: true });
    t.uuid('shelved_by').references('users.id').onDelete('SET NULL');
    t.text('shelve_reason');
    t.timestamp('closed_at', { useTz: true });
    t.uuid('closed_by').references('users.id').onDelete('SET NULL');
    t.text('close_cause');
    t.text('close_note');
    t.text('summary').notNullable();
    t.jsonb('detail').notNullable().defaultTo('{}');
    t.jsonb('direction');
    t.smallint('escalation_level').notNullable().defaultTo(0);
    t.timestamp('notified_at', { useTz: true });
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['state', 'raised_at']);
    t.index(['loop_id', 'raised_at']);
  });
  await knex.raw(`ALTER TABLE alerts
    ADD CONSTRAINT alerts_rule_kind_known CHECK (rule_kind IN ('band','cusum','nis','stale','model')),
    ADD CONSTRAINT alerts_priority_range CHECK (priority BETWEEN 1 AND 3),
    ADD CONSTRAINT alerts_state_known CHECK (state IN ('unacknowledged','acknowledged','returned_unacknowledged','shelved','closed')),
    ADD CONSTRAINT alerts_close_cause_known CHECK (close_cause IS NULL OR close_cause IN ('sensor_fault','actuator_fault','process_change','model_out_of_date','other')),
    ADD CONSTRAINT alerts_closed_has_cause CHECK (state <> 'closed' OR (closed_at IS NOT NULL AND close_cause IS NOT NULL)),
    ADD CONSTRAINT alerts_shelved_has_until CHECK (state <> 'shelved' OR (shelved_until IS NOT NULL AND shelve_reason IS NOT NULL))`);
  // One alert per loop and rule while it is open: a continuing condition never makes a second one.
  await knex.raw(`CREATE UNIQUE INDEX alerts_one_open_per_rule ON alerts (loop_id, rule_kind) WHERE state <> 'closed'`);

  await knex.schema.createTable('alert_events', (t) => {
    t.bigIncrements('id').primary();
    t.uuid('alert_id').notNullable().references('alerts.id').onDelete('CASCADE');
    t.timestamp('at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.text('kind').notNullable();
    t.uuid('actor_id').references('users.id').onDelete('SET NULL');
    t.text('from_state');
    t.text('to_state');
    t.text('note');
    t.jsonb('details').notNullable().defaultTo('{}');
    t.index(['alert_id', 'at']);
    t.index(['kind', 'at']);
  });

  // Raises while the loop was in maintenance: recorded, nobody called.
  await knex.schema.createTable('alert_suppressions', (t) => {
    t.bigIncrements('id').primary();
    t.uuid('loop_id').notNullable().references('loops.id').onDelete('CASCADE');
    t.text('rule_kind').notNullable();
    t.timestamp('at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.text('summary').notNullable();
    t.jsonb('detail').notNullable().defaultTo('{}');
    t.index(['loop_id', 'at']);
  });

  await knex.schema.createTable('oncall_shifts', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    /** null: plant-wide. */
    t.text('area_id').references('areas.id').onDelete('CASCADE');
    t.text('position').notNullable();
    t.timestamp('starts_at', { useTz: true }).notNullable();
    t.timestamp('ends_at', { useTz: true }).notNullable();
    t.text('note').notNullable().defaultTo('');
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['starts_at', 'ends_at']);
  });
  await knex.raw(`ALTER TABLE oncall_shifts
    ADD CONSTRAINT oncall_shifts_position_known CHECK (position IN ('primary','secondary')),
    ADD CONSTRAINT oncall_shifts_ends_after_start CHECK (ends_at > starts_at)`);

  // The third escalation step: an area's engineers.
  await knex.schema.createTable('area_engineers', (t) => {
    t.text('area_id').notNullable().references('areas.id').onDelete('CASCADE');
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.primary(['area_id', 'user_id']);
  });

  // One row: escalation timings, link lifetime, shelving limit, alert-load targets.
  await knex.schema.createTable('alert_settings', (t) => {
    t.smallint('id').primary().defaultTo(1);
    t.integer('secondary_after_min').notNullable().defaultTo(10);
    t.integer('area_after_min').notNullable().defaultTo(30);
    t.integer('ack_link_ttl_min').notNullable().defaultTo(240);
    t.integer('shelve_max_hours').notNullable().defaultTo(24);
    t.integer('target_per_day').notNullable().defaultTo(144);
    t.integer('target_per_10min').notNullable().defaultTo(1);
    t.integer('flood_per_10min').notNullable().defaultTo(10);
    t.uuid('updated_by').references('users.id').onDelete('SET NULL');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`ALTER TABLE alert_settings ADD CONSTRAINT alert_settings_one_row CHECK (id = 1),
    ADD CONSTRAINT alert_settings_positive CHECK (secondary_after_min > 0 AND area_after_min > secondary_after_min
      AND ack_link_ttl_min > 0 AND shelve_max_hours > 0 AND target_per_day > 0 AND target_per_10min > 0 AND flood_per_10min > 0)`);
  await knex('alert_settings').insert({ id: 1 });

  await knex.schema.createTable('mail_outbox', (t) => {
    t.bigIncrements('id').primary();
    t.uuid('alert_id').references('alerts.id').onDelete('SET NULL');
    t.text('reason').notNullable();
    t.uuid('to_user_id').references('users.id').onDelete('SET NULL');
    t.text('to_address').notNullable();
    t.text('subject').notNullable();
    t.text('text').notNullable();
    /** Fixed when queued, so a receiver can tell a resend of the same message. */
    t.text('message_id').notNullable().unique();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.integer('attempts').notNullable().defaultTo(0);
    t.timestamp('next_attempt_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('sent_at', { useTz: true });
    t.text('last_error');
  });
  await knex.raw(`CREATE INDEX mail_outbox_due ON mail_outbox (next_attempt_at) WHERE sent_at IS NULL`);

  // One-click acknowledge links: the token is signed; this row makes it work once.
  await knex.schema.createTable('alert_ack_links', (t) => {
    t.uuid('id').primary();
    t.uuid('alert_id').notNullable().references('alerts.id').onDelete('CASCADE');
    t.uuid('user_id').references('users.id').onDelete('CASCADE');
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('used_at', { useTz: true });
    t.uuid('used_by').references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  // The local capture stores a message once, even when a sender retries after a lost reply.
  await knex.raw(`CREATE UNIQUE INDEX dev_mail_message_id_once ON dev_mail (message_id) WHERE message_id IS NOT NULL`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('DROP INDEX IF EXISTS dev_mail_message_id_once');
  for (const table of [
    'alert_ack_links',
    'mail_outbox',
    'alert_settings',
    'area_engineers',
    'oncall_shifts',
    'alert_suppressions',
    'alert_events',
    'alerts',
    'drift_rule_versions',
    'drift_rules',
  ]) {
    await knex.schema.dropTableIfExists(table);
  }
  await knex.raw('ALTER TABLE loop_tracking DROP COLUMN IF EXISTS rule_state');
}
