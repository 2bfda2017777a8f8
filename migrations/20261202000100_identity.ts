import type { Knex } from 'knex';

/** People, their roles, browser sessions, scripts' access tokens and the audit trail. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('email').notNullable().unique();
    t.text('name').notNullable();
    t.text('oidc_subject').unique();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('last_sign_in_at', { useTz: true });
  });
  await knex.raw(`ALTER TABLE users ADD CONSTRAINT users_email_lower CHECK (email = lower(email))`);

  await knex.schema.createTable('user_roles', (t) => {
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('role').notNullable();
    t.primary(['user_id', 'role']);
  });
  await knex.raw(
    `ALTER TABLE user_roles ADD CONSTRAINT user_roles_known CHECK (role IN ('operator','engineer','oncall','admin'))`,
  );

  // The table connect-pg-simple expects.
  await knex.schema.createTable('sessions', (t) => {
    t.string('sid').primary();
    t.json('sess').notNullable();
    t.timestamp('expire', { precision: 6 }).notNullable().index();
  });

  await knex.schema.createTable('access_tokens', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('label').notNullable();
    t.text('prefix').notNullable();
    t.text('token_hash').notNullable().unique();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('last_used_at', { useTz: true });
    t.timestamp('revoked_at', { useTz: true });
    t.index(['user_id']);
  });

  await knex.schema.createTable('audit_log', (t) => {
    t.bigIncrements('id').primary();
    t.timestamp('at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.uuid('actor_user_id').references('users.id').onDelete('SET NULL');
    t.text('actor_email');
    t.text('action').notNullable();
    t.text('target_type');
    t.text('target_id');
    t.jsonb('details').notNullable().defaultTo('{}');
    t.index(['at']);
    t.index(['action', 'at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['audit_log', 'access_tokens', 'sessions', 'user_roles', 'users']) {
    await knex.schema.dropTableIfExists(table);
  }
}
