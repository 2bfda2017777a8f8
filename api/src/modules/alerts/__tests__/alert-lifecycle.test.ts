import { describe, expect, it } from 'vitest';
import type { AlertState } from '../../../contracts/alerts.js';
import {
  raise,
  transition,
  type LifecycleAction,
  type LifecycleAlert,
  type LifecycleResult,
} from '../alert-lifecycle.js';

const T0 = new Date('2026-12-02T08:00:00Z');
const at = (minutes: number) => new Date(T0.getTime() + minutes * 60_000);
const ENGINEER = '00000000-0000-4000-8000-000000000001';

const fresh = () => raise().next;
const clear = (m = 1): LifecycleAction => ({ type: 'clear', at: at(m) });
const reraise = (m = 2): LifecycleAction => ({ type: 'reraise', at: at(m) });
const acknowledge = (m = 3): LifecycleAction => ({ type: 'acknowledge', at: at(m), actor: ENGINEER });
const shelve = (hours = 2, reason = 'valve work', m = 4): LifecycleAction => ({
  type: 'shelve',
  at: at(m),
  actor: ENGINEER,
  until: at(m + hours * 60),
  reason,
  maxHours: 24,
});
const expire = (m = 600): LifecycleAction => ({ type: 'expire_shelve', at: at(m) });
const close = (cause: 'sensor_fault' | null = 'sensor_fault', note = 'replaced the probe'): LifecycleAction => ({
  type: 'close',
  at: at(5),
  actor: ENGINEER,
  cause,
  note,
});

function next(result: LifecycleResult): LifecycleAlert {
  if (result.outcome !== 'changed') throw new Error(`expected a change, got ${JSON.stringify(result)}`);
  return result.next;
}
function run(alert: LifecycleAlert, ...actions: LifecycleAction[]): LifecycleAlert {
  return actions.reduce((a, action) => next(transition(a, action)), alert);
}
const stateOf = (a: LifecycleAlert) => ({ state: a.state, active: a.active, activations: a.activations });
const withState = (state: AlertState, active: boolean): LifecycleAlert => ({
  ...fresh(),
  state,
  active,
  ...(state === 'shelved' ? { shelvedUntil: at(60), shelvedBy: ENGINEER, shelveReason: 'work' } : {}),
});

describe('raise', () => {
  it('makes an unacknowledged, active alert and calls people', () => {
    const raised = raise();
    expect(stateOf(raised.next)).toEqual({ state: 'unacknowledged', active: true, activations: 1 });
    expect(raised.event).toBe('raised');
    expect(raised.mail).toBe('raised');
  });
});

describe('clear', () => {
  it('turns unacknowledged into returned_unacknowledged', () => {
    const result = transition(fresh(), clear());
    expect(result).toMatchObject({ outcome: 'changed', event: 'cleared', mail: null });
    expect(stateOf(next(result))).toEqual({ state: 'returned_unacknowledged', active: false, activations: 1 });
    expect(next(result).clearedAt).toEqual(at(1));
  });

  it('keeps an acknowledged alert acknowledged, inactive', () => {
    const a = run(fresh(), acknowledge(), clear(4));
    expect(stateOf(a)).toEqual({ state: 'acknowledged', active: false, activations: 1 });
  });

  it('keeps a shelved alert shelved, inactive', () => {
    const a = run(fresh(), shelve(), clear(5));
    expect(stateOf(a)).toEqual({ state: 'shelved', active: false, activations: 1 });
    expect(a.shelveReason).toBe('valve work');
  });

  it('changes nothing when the condition is already gone or the alert is closed', () => {
    expect(transition(run(fresh(), clear()), clear(2))).toEqual({ outcome: 'unchanged' });
    expect(transition(run(fresh(), close()), clear(6))).toEqual({ outcome: 'unchanged' });
  });
});

describe('re-raise of an open alert', () => {
  it('returned_unacknowledged → unacknowledged, without a new mail', () => {
    const result = transition(run(fresh(), clear()), reraise());
    expect(result).toMatchObject({ outcome: 'changed', event: 'reactivated', mail: null });
    expect(stateOf(next(result))).toEqual({ state: 'unacknowledged', active: true, activations: 2 });
    expect(next(result).clearedAt).toBeNull();
  });

  it('acknowledged (cleared) → unacknowledged, calling people again', () => {
    const result = transition(run(fresh(), acknowledge(), clear(4)), reraise(5));
    expect(result).toMatchObject({ outcome: 'changed', event: 'reactivated', mail: 'reactivated' });
    expect(stateOf(next(result))).toEqual({ state: 'unacknowledged', active: true, activations: 2 });
    expect(next(result).acknowledgedBy).toBeNull();
  });

  it('shelved: only active again, still shelved, no mail', () => {
    const result = transition(run(fresh(), shelve(), clear(5)), reraise(6));
    expect(result).toMatchObject({ outcome: 'changed', event: 'reactivated', mail: null });
    expect(stateOf(next(result))).toEqual({ state: 'shelved', active: true, activations: 2 });
  });

  it('changes nothing while the condition continues', () => {
    expect(transition(fresh(), reraise())).toEqual({ outcome: 'unchanged' });
    expect(transition(run(fresh(), acknowledge()), reraise())).toEqual({ outcome: 'unchanged' });
    expect(transition(run(fresh(), shelve()), reraise())).toEqual({ outcome: 'unchanged' });
  });

  it('never reopens a closed alert', () => {
    expect(transition(run(fresh(), close()), reraise())).toEqual({ outcome: 'unchanged' });
  });
});

describe('acknowledge', () => {
  it('before the clear: unacknowledged → acknowledged (active), then the clear keeps it acknowledged', () => {
    const acknowledged = run(fresh(), acknowledge(1));
    expect(stateOf(acknowledged)).toEqual({ state: 'acknowledged', active: true, activations: 1 });
    expect(acknowledged).toMatchObject({ acknowledgedAt: at(1), acknowledgedBy: ENGINEER });
    expect(stateOf(run(acknowledged, clear(2)))).toEqual({ state: 'acknowledged', active: false, activations: 1 });
  });

  it('after the clear: returned_unacknowledged → acknowledged (inactive)', () => {
    const result = transition(run(fresh(), clear(1)), acknowledge(2));
    expect(result).toMatchObject({ outcome: 'changed', event: 'acknowledged', mail: null });
    expect(stateOf(next(result))).toEqual({ state: 'acknowledged', active: false, activations: 1 });
  });

  it.each([
    ['acknowledged', 'already_acknowledged', /already acknowledged/],
    ['shelved', 'alert_shelved', /shelved/],
    ['closed', 'alert_closed', /closed/],
  ] as const)('refuses a %s alert with 409', (state, code, reason) => {
    const result = transition(withState(state, true), acknowledge());
    expect(result).toMatchObject({ outcome: 'refused', status: 409, code });
    expect(result.outcome === 'refused' && result.reason).toMatch(reason);
  });
});

describe('shelve', () => {
  it.each([
    ['unacknowledged', true],
    ['acknowledged', true],
    ['returned_unacknowledged', false],
    ['shelved', true],
  ] as const)('shelves a %s alert with its end and reason', (state, active) => {
    const result = transition(withState(state, active), shelve(3, '  pump swap  '));
    expect(result).toMatchObject({ outcome: 'changed', event: 'shelved', mail: null });
    expect(next(result)).toMatchObject({
      state: 'shelved',
      active,
      shelvedUntil: at(4 + 180),
      shelvedBy: ENGINEER,
      shelveReason: 'pump swap',
    });
  });

  it('refuses an end in the past or now, beyond the limit, and a missing reason (422)', () => {
    const alert = fresh();
    expect(transition(alert, shelve(0))).toMatchObject({ outcome: 'refused', status: 422, code: 'shelve_until_past' });
    expect(transition(alert, shelve(-1))).toMatchObject({ outcome: 'refused', status: 422, code: 'shelve_until_past' });
    expect(transition(alert, shelve(24.01))).toMatchObject({
      outcome: 'refused',
      status: 422,
      code: 'shelve_too_long',
    });
    expect(transition(alert, shelve(2, '   '))).toMatchObject({
      outcome: 'refused',
      status: 422,
      code: 'shelve_reason_missing',
    });
    expect(next(transition(alert, shelve(24))).state).toBe('shelved');
  });

  it('refuses a closed alert (409)', () => {
    expect(transition(withState('closed', false), shelve())).toMatchObject({
      outcome: 'refused',
      status: 409,
      code: 'alert_closed',
    });
  });
});

describe('shelve expiry', () => {
  it('active condition → unacknowledged, calling people (shelve_expired)', () => {
    const result = transition(run(fresh(), acknowledge(), shelve()), expire());
    expect(result).toMatchObject({ outcome: 'changed', event: 'unshelved', mail: 'shelve_expired' });
    expect(next(result)).toMatchObject({
      state: 'unacknowledged',
      active: true,
      shelvedUntil: null,
      acknowledgedBy: null,
    });
  });

  it('condition gone → back to normal: acknowledged by whoever shelved it, no mail; its return calls people again', () => {
    const shelved = run(fresh(), shelve(), clear(10));
    const result = transition(shelved, expire());
    expect(result).toMatchObject({ outcome: 'changed', event: 'unshelved', mail: null });
    expect(next(result)).toMatchObject({
      state: 'acknowledged',
      active: false,
      shelveReason: null,
      acknowledgedBy: shelved.shelvedBy,
    });
    expect(transition(next(result), { type: 'reraise', at: at(700) })).toMatchObject({
      outcome: 'changed',
      event: 'reactivated',
      mail: 'reactivated',
    });
  });

  it('refuses before the end and for an alert that is not shelved', () => {
    expect(transition(run(fresh(), shelve(2)), expire(60))).toMatchObject({
      outcome: 'refused',
      code: 'shelf_time_running',
    });
    expect(transition(fresh(), expire())).toMatchObject({ outcome: 'refused', status: 409, code: 'not_shelved' });
  });
});

describe('close', () => {
  it.each([
    ['unacknowledged', true],
    ['acknowledged', false],
    ['returned_unacknowledged', false],
    ['shelved', true],
  ] as const)('closes a %s alert with cause and note', (state, active) => {
    const result = transition(withState(state, active), close('sensor_fault', ' probe fouled '));
    expect(result).toMatchObject({ outcome: 'changed', event: 'closed', mail: null });
    expect(next(result)).toMatchObject({
      state: 'closed',
      active: false,
      closedAt: at(5),
      closedBy: ENGINEER,
      closeCause: 'sensor_fault',
      closeNote: 'probe fouled',
      shelvedUntil: null,
    });
  });

  it('refuses without a cause or a note (422) and a second close (409)', () => {
    expect(transition(fresh(), close(null))).toMatchObject({
      outcome: 'refused',
      status: 422,
      code: 'close_cause_missing',
    });
    expect(transition(fresh(), close('sensor_fault', ' '))).toMatchObject({
      outcome: 'refused',
      status: 422,
      code: 'close_note_missing',
    });
    expect(transition(run(fresh(), close()), close())).toMatchObject({
      outcome: 'refused',
      status: 409,
      code: 'alert_closed',
    });
  });
});
