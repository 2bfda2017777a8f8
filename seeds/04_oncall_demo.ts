import type { Knex } from 'knex';

const PRIMARY = 'oncall@quillmere.example';
const SECONDARY = 'admin@quillmere.example';
const DAY_MS = 86_400_000;
/** Daily shifts hand over at 06:00 UTC: from yesterday's handover to two weeks ahead. */
const HANDOVER_HOUR_UTC = 6;
const DAYS_BACK = 1;
const DAYS_AHEAD = 14;
const AREA_ENGINEERS: Record<string, string> = {
  aeration: 'engineer@quillmere.example',
  storage: 'engineer@quillmere.example',
  digestion: 'reviewer@quillmere.example',
  disinfection: 'reviewer@quillmere.example',
};

async function userId(trx: Knex.Transaction, email: string): Promise<string> {
  const row = await trx('users').where({ email }).first<{ id: string } | undefined>('id');
  if (!row) throw new Error(`the on-call demo needs the demo user ${email} (seeds/01_demo_users.ts)`);
  return row.id;
}

type Slot = { startsAt: Date; endsAt: Date };

function dailyShifts(now: Date): Slot[] {
  const todayHandover = Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate(), HANDOVER_HOUR_UTC);
  return Array.from({ length: DAYS_BACK + DAYS_AHEAD + 1 }, (_, i) => {
    const start = todayHandover + (i - DAYS_BACK) * DAY_MS;
    return { startsAt: new Date(start), endsAt: new Date(start + DAY_MS) };
  });
}

const covered = (trx: Knex.Transaction, position: string, shift: Slot) =>
  trx('oncall_shifts')
    .whereNull('area_id')
    .andWhere({ position })
    .andWhere('starts_at', '<', shift.endsAt)
    .andWhere('ends_at', '>', shift.startsAt)
    .first('id');

/** Someone removed a plant-wide shift of this position in that slot: leave the gap they made. */
const removedByHand = (trx: Knex.Transaction, position: string, shift: Slot) =>
  trx('audit_log')
    .where({ action: 'oncall_shift.deleted' })
    .whereRaw(`details->'before'->>'area' IS NULL AND details->'before'->>'position' = ?`, [position])
    .whereRaw(`(details->'before'->>'startsAt')::timestamptz < ?`, [shift.endsAt])
    .whereRaw(`(details->'before'->>'endsAt')::timestamptz > ?`, [shift.startsAt])
    .first('id');

/** Plant-wide daily shifts for one person, skipping any day already covered or cleared by hand. */
async function fillPosition(trx: Knex.Transaction, email: string, position: 'primary' | 'secondary') {
  const user = await userId(trx, email);
  for (const shift of dailyShifts(new Date())) {
    if ((await covered(trx, position, shift)) || (await removedByHand(trx, position, shift))) continue;
    await trx('oncall_shifts').insert({
      user_id: user,
      area_id: null,
      position,
      starts_at: shift.startsAt,
      ends_at: shift.endsAt,
      note: 'Demo rota',
    });
  }
}

/**
 * An area's demo engineers, only while the area has none and no one has ever set them by hand
 * (an audited change), so an administrator's choice is never overwritten.
 */
async function fillAreaEngineers(trx: Knex.Transaction) {
  for (const [area, email] of Object.entries(AREA_ENGINEERS)) {
    if (!(await trx('areas').where({ id: area }).first('id'))) continue;
    if (await trx('area_engineers').where({ area_id: area }).first('user_id')) continue;
    const changed = await trx('audit_log').where({ action: 'area_engineers.changed', target_id: area }).first('id');
    if (changed) continue;
    await trx('area_engineers').insert({ area_id: area, user_id: await userId(trx, email) });
  }
}

/**
 * The demo on-call rota, run on every start: Dara Okafor primary and Ruth Ellery secondary,
 * plant-wide, in daily shifts from yesterday's 06:00 UTC handover to two weeks ahead, so someone
 * is always on call; days already covered, or whose shift someone deleted, are left alone. Area engineers:
 * Tobias Renner for Aeration and Storage, Priya Hallam for Digestion and Disinfection.
 */
export async function seed(knex: Knex): Promise<void> {
  await knex.transaction(async (trx) => {
    // The same lock the rota's API takes, so the overlap check holds against people editing.
    await trx.raw('LOCK TABLE oncall_shifts IN SHARE ROW EXCLUSIVE MODE');
    await fillPosition(trx, PRIMARY, 'primary');
    await fillPosition(trx, SECONDARY, 'secondary');
    await fillAreaEngineers(trx);
  });
}
