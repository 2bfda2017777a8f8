import type { Knex } from 'knex';
import type { AlertRow } from './alerts.repository.js';

const utc = (d: Date) => `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
const at = (d: Date | null) => (d ? ` at ${utc(d)}` : '');

async function nameOf(trx: Knex.Transaction, userId: string | null): Promise<string | null> {
  if (!userId) return null;
  const user = (await trx('users').where({ id: userId }).first('name')) as { name: string } | undefined;
  return user?.name ?? null;
}

/**
 * The life cycle's reason with the alert named and, where it helps the person who lost a race,
 * who got there first and when.
 */
export async function refusalMessage(trx: Knex.Transaction, row: AlertRow, reason: string): Promise<string> {
  const loop = (await trx('loops').where({ id: row.loop_id }).first('tag')) as { tag: string } | undefined;
  const name = `Alert #${Number(row.number)}${loop ? ` on ${loop.tag}` : ''}`;
  let who = '';
  if (row.state === 'acknowledged') {
    const by = await nameOf(trx, row.acknowledged_by);
    who = by ? ` ${by} acknowledged it${at(row.acknowledged_at)}.` : '';
  } else if (row.state === 'closed') {
    const by = await nameOf(trx, row.closed_by);
    who = by ? ` ${by} closed it${at(row.closed_at)}.` : '';
  } else if (row.state === 'shelved' && row.shelved_until) {
    who = ` It is shelved until ${utc(row.shelved_until)}.`;
  }
  return `${name}: ${reason}${who}`;
}
