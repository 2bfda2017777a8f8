import type { AlertState, CloseCause } from '../../contracts/alerts.js';

/**
 * The alert life cycle as a pure state machine (alarm-management concepts of ISA-18.2): the state
 * says what people have done, `active` whether the condition is present now. Every action answers
 * the next alert, the timeline event and which e-mail (if any) the caller queues in the same
 * transaction — or a refusal with the HTTP status and a reason.
 */
export type MailReason = 'raised' | 'reactivated' | 'shelve_expired';
export type LifecycleEventKind =
  'raised' | 'reactivated' | 'cleared' | 'acknowledged' | 'shelved' | 'unshelved' | 'closed';

export interface LifecycleAlert {
  state: AlertState;
  active: boolean;
  activations: number;
  clearedAt: Date | null;
  acknowledgedAt: Date | null;
  acknowledgedBy: string | null;
  shelvedUntil: Date | null;
  shelvedBy: string | null;
  shelveReason: string | null;
  closedAt: Date | null;
  closedBy: string | null;
  closeCause: CloseCause | null;
  closeNote: string | null;
}

/** `at` is when it happens; `actor` the user id, null for the system. */
export type LifecycleAction =
  | { type: 'clear'; at: Date }
  | { type: 'reraise'; at: Date }
  | { type: 'acknowledge'; at: Date; actor: string }
  | { type: 'shelve'; at: Date; actor: string; until: Date; reason: string; maxHours: number }
  | { type: 'expire_shelve'; at: Date }
  | { type: 'close'; at: Date; actor: string; cause: CloseCause | null; note: string };

export type LifecycleResult =
  | { outcome: 'changed'; next: LifecycleAlert; event: LifecycleEventKind; mail: MailReason | null }
  /** Nothing to do: a continuing condition raised again, or a clear of a condition already gone. */
  | { outcome: 'unchanged' }
  | { outcome: 'refused'; status: 409 | 422; code: string; reason: string };

const OPEN: readonly AlertState[] = ['unacknowledged', 'acknowledged', 'returned_unacknowledged', 'shelved'];
export const isOpen = (state: AlertState) => OPEN.includes(state);

const changed = (next: LifecycleAlert, event: LifecycleEventKind, mail: MailReason | null = null): LifecycleResult => ({
  outcome: 'changed',
  next,
  event,
  mail,
});
const refused = (status: 409 | 422, code: string, reason: string): LifecycleResult => ({
  outcome: 'refused',
  status,
  code,
  reason,
});
const closedRefusal = (what: string) => refused(409, 'alert_closed', `The alert is closed; it cannot be ${what}.`);
const leaveShelf = { shelvedUntil: null, shelvedBy: null, shelveReason: null };

/** A new alert: unacknowledged, its condition present. */
export function raise(): { next: LifecycleAlert; event: 'raised'; mail: 'raised' } {
  const next: LifecycleAlert = {
    state: 'unacknowledged',
    active: true,
    activations: 1,
    clearedAt: null,
    acknowledgedAt: null,
    acknowledgedBy: null,
    ...leaveShelf,
    closedAt: null,
    closedBy: null,
    closeCause: null,
    closeNote: null,
  };
  return { next, event: 'raised', mail: 'raised' };
}

export function transition(alert: LifecycleAlert, action: LifecycleAction): LifecycleResult {
  switch (action.type) {
    case 'clear':
      return clear(alert, action.at);
    case 'reraise':
      return reraise(alert);
    case 'acknowledge':
      return acknowledge(alert, action.at, action.actor);
    case 'shelve':
      return shelve(alert, action);
    case 'expire_shelve':
      return expireShelve(alert, action.at);
    case 'close':
      return close(alert, action);
  }
}

/** The condition went away: an unacknowledged alert returns to normal unacknowledged. */
function clear(alert: LifecycleAlert, at: Date): LifecycleResult {
  if (alert.state === 'closed' || !alert.active) return { outcome: 'unchanged' };
  const state = alert.state === 'unacknowledged' ? 'returned_unacknowledged' : alert.state;
  return changed({ ...alert, state, active: false, clearedAt: at }, 'cleared');
}

/** The condition came back on an open alert: people are called again only if they had acknowledged. */
function reraise(alert: LifecycleAlert): LifecycleResult {
  if (alert.state === 'closed' || alert.active) return { outcome: 'unchanged' };
  const again = { ...alert, active: true, activations: alert.activations + 1, clearedAt: null };
  if (alert.state === 'shelved') return changed(again, 'reactivated');
  const unacknowledged = { ...again, state: 'unacknowledged' as const, acknowledgedAt: null, acknowledgedBy: null };
  return changed(unacknowledged, 'reactivated', alert.state === 'acknowledged' ? 'reactivated' : null);
}

function acknowledge(alert: LifecycleAlert, at: Date, actor: string): LifecycleResult {
  switch (alert.state) {
    case 'unacknowledged':
    case 'returned_unacknowledged':
      return changed({ ...alert, state: 'acknowledged', acknowledgedAt: at, acknowledgedBy: actor }, 'acknowledged');
    case 'acknowledged':
      return refused(409, 'already_acknowledged', 'The alert is already acknowledged.');
    case 'shelved':
      return refused(
        409,
        'alert_shelved',
        'The alert is shelved; it comes back by itself when the shelf time ends, or close it with a cause.',
      );
    case 'closed':
      return closedRefusal('acknowledged');
  }
}

function shelve(alert: LifecycleAlert, action: Extract<LifecycleAction, { type: 'shelve' }>): LifecycleResult {
  if (!isOpen(alert.state)) return closedRefusal('shelved');
  if (!action.reason.trim()) return refused(422, 'shelve_reason_missing', 'Say why the alert is shelved.');
  if (!(action.until.getTime() > action.at.getTime()))
    return refused(422, 'shelve_until_past', 'The shelf time must end in the future.');
  const maxMs = action.maxHours * 3_600_000;
  if (action.until.getTime() - action.at.getTime() > maxMs) {
    return refused(
      422,
      'shelve_too_long',
      `An alert may be shelved for at most ${action.maxHours} h; pick an end within that time.`,
    );
  }
  const next = { ...alert, state: 'shelved' as const, shelvedUntil: action.until, shelvedBy: action.actor };
  return changed({ ...next, shelveReason: action.reason.trim() }, 'shelved');
}

/**
 * The shelf time ended: a present condition calls people again. A condition that went away while
 * shelved returns to normal (ISA-18.2's unshelve): the alert counts as acknowledged by whoever
 * shelved it, so that the condition coming back calls people again (mail `reactivated`).
 */
function expireShelve(alert: LifecycleAlert, at: Date): LifecycleResult {
  if (alert.state !== 'shelved') return refused(409, 'not_shelved', 'The alert is not shelved.');
  if (alert.shelvedUntil && alert.shelvedUntil.getTime() > at.getTime())
    return refused(409, 'shelf_time_running', 'The shelf time has not ended yet.');
  const base = { ...alert, ...leaveShelf, acknowledgedAt: null, acknowledgedBy: null };
  if (alert.active) return changed({ ...base, state: 'unacknowledged' }, 'unshelved', 'shelve_expired');
  return changed({ ...base, state: 'acknowledged', acknowledgedAt: at, acknowledgedBy: alert.shelvedBy }, 'unshelved');
}

/** Done with it: a cause and a note; a closed alert no longer follows its condition. */
function close(alert: LifecycleAlert, action: Extract<LifecycleAction, { type: 'close' }>): LifecycleResult {
  if (!isOpen(alert.state)) return refused(409, 'alert_closed', 'The alert is already closed.');
  if (!action.cause) return refused(422, 'close_cause_missing', 'Pick the cause that was found.');
  if (!action.note.trim()) return refused(422, 'close_note_missing', 'Say what was found or done.');
  return changed(
    {
      ...alert,
      ...leaveShelf,
      state: 'closed',
      active: false,
      closedAt: action.at,
      closedBy: action.actor,
      closeCause: action.cause,
      closeNote: action.note.trim(),
    },
    'closed',
  );
}
