import type { Knex } from 'knex';
import type { Person } from '../../contracts/alerts.js';
import { findOnCallPeople, type OnCallPerson } from '../oncall/oncall-lookup.js';
import type { AlertMailReason } from './alert-mail-text.js';

export interface Recipient extends Person {
  /** Holds the on-call role, so a one-click acknowledge link is of use to them. */
  mayAcknowledge: boolean;
}

export interface Audience {
  people: Recipient[];
  /** Said in the message when the usual addressee is missing. */
  note: string | null;
}

const usersWithRole = (trx: Knex.Transaction, role: 'oncall' | 'engineer') =>
  trx('users as u')
    .join('user_roles as r', 'r.user_id', 'u.id')
    .where('r.role', role)
    .orderBy('u.email')
    .select<Person[]>('u.id', 'u.name', 'u.email');

const areaEngineers = (trx: Knex.Transaction, areaId: string) =>
  trx('area_engineers as ae')
    .join('users as u', 'u.id', 'ae.user_id')
    .where('ae.area_id', areaId)
    .orderBy('u.email')
    .select<Person[]>('u.id', 'u.name', 'u.email');

/** The on-call pair with whether each may acknowledge (oncall/oncall-lookup.ts decides who it is). */
async function onCallWithRoles(trx: Knex.Transaction, areaId: string, at: Date) {
  const { primary, secondary } = await findOnCallPeople(trx, areaId, at);
  const asRecipient = (p: OnCallPerson | null): Recipient | null =>
    p && { id: p.id, name: p.name, email: p.email, mayAcknowledge: p.holdsOnCallRole };
  return { primary: asRecipient(primary), secondary: asRecipient(secondary) };
}

/** People, with whether each may acknowledge when that is already known (undefined: look it up). */
type Told = { people: (Person & { mayAcknowledge?: boolean })[]; note: string | null };

async function whoToTell(
  trx: Knex.Transaction,
  reason: AlertMailReason,
  area: { id: string; name: string },
  at: Date,
): Promise<Told> {
  if (reason === 'escalated_area') {
    const own = await areaEngineers(trx, area.id);
    if (own.length) return { people: own, note: null };
    return {
      people: await usersWithRole(trx, 'engineer'),
      note: `${area.name} has no engineers assigned, so this goes to every engineer.`,
    };
  }
  const onCall = await onCallWithRoles(trx, area.id, at);
  if (reason === 'escalated_secondary') return { people: onCall.secondary ? [onCall.secondary] : [], note: null };
  if (onCall.primary) return { people: [onCall.primary], note: null };
  return {
    // everyone here holds the on-call role
    people: (await usersWithRole(trx, 'oncall')).map((p) => ({ ...p, mayAcknowledge: true })),
    note: `Nobody is on call for ${area.name} right now, so this goes to everyone who holds the on-call role.`,
  };
}

/**
 * Who hears of an alert: raise, re-raise and shelve end → the primary on call for the area (else
 * everyone with the on-call role, so no alert goes unheard); escalation → the secondary, then the
 * area's engineers (else every engineer).
 */
export async function pickRecipients(
  trx: Knex.Transaction,
  reason: AlertMailReason,
  area: { id: string; name: string },
  at: Date,
): Promise<Audience> {
  const { people, note } = await whoToTell(trx, reason, area, at);
  const unique = [...new Map(people.map((p) => [p.id, p])).values()];
  const unknown = unique.filter((p) => p.mayAcknowledge === undefined).map((p) => p.id);
  const acknowledgers = new Set(
    unknown.length
      ? (await trx('user_roles').where('role', 'oncall').whereIn('user_id', unknown).pluck<string[]>('user_id')).map(
          String,
        )
      : [],
  );
  return {
    people: unique.map(({ mayAcknowledge, ...p }) => ({
      ...p,
      mayAcknowledge: mayAcknowledge ?? acknowledgers.has(p.id),
    })),
    note,
  };
}
