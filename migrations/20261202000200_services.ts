import type { Knex } from 'knex';

/** Service heartbeats (health page) and the development mailbox of the local mail server. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('service_heartbeats', (t) => {
    t.text('service').notNullable();
    t.text('instance').notNullable();
    t.timestamp('beat_at', { useTz: true }).notNullable();
    t.timestamp('started_at', { useTz: true }).notNullable();
    t.jsonb('details').notNullable().defaultTo('{}');
    t.primary(['service', 'instance']);
  });

  await knex.schema.createTable('dev_mail', (t) => {
    t.bigIncrements('id').primary();
    t.text('message_id');
    t.text('from_address');
    t.specificType('to_addresses', 'text[]').notNullable();
    t.text('subject').notNullable().defaultTo('');
    t.text('text').notNullable().defaultTo('');
    t.text('html');
    t.timestamp('received_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['received_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('dev_mail');
  await knex.schema.dropTableIfExists('service_heartbeats');
}
