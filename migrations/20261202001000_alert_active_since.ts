import type { Knex } from 'knex';

/**
 * When an alert's condition became present the last time: the raise, or its latest re-raise. The
 * queue and the alert page count "for how long" from here; raised_at stays the first raise (an
 * alert re-raised after hours of being cleared had said "active 3 h so far"). Existing alerts take
 * the time of their latest raised or reactivated event.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE alerts ADD COLUMN active_since timestamptz');
  await knex.raw(`UPDATE alerts a SET active_since = coalesce(
    (SELECT max(e.at) FROM alert_events e WHERE e.alert_id = a.id AND e.kind IN ('raised', 'reactivated')),
    a.raised_at)`);
  await knex.raw(
    'ALTER TABLE alerts ALTER COLUMN active_since SET DEFAULT now(), ALTER COLUMN active_since SET NOT NULL',
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE alerts DROP COLUMN active_since');
}
