import { formatDuration } from '../../../lib/format-number';

export type TimedCondition = {
  active: boolean;
  /** The latest time the condition became present (the raise, or a re-raise). */
  activeSince: string;
  clearedAt: string | null;
  closedAt: string | null;
};

/**
 * The condition in a word: `active`, `cleared`, or — for an alert closed while its condition was
 * still present — `closed before it cleared` (a closed alert no longer follows its condition).
 */
export function conditionWord(alert: TimedCondition): string {
  if (alert.active) return 'active';
  return alert.clearedAt || !alert.closedAt ? 'cleared' : 'closed before it cleared';
}

/**
 * How long the condition has lasted this time (since it became present the last time): up to now
 * while active, up to its clearing, or up to the close.
 */
export function conditionDuration(alert: TimedCondition, nowMs: number): string {
  const raised = Date.parse(alert.activeSince);
  const span = (endMs: number) => formatDuration(Math.max(0, (endMs - raised) / 1000));
  if (alert.active) return `${span(nowMs)} so far`;
  if (alert.clearedAt) return `${span(Date.parse(alert.clearedAt))}, then cleared`;
  if (alert.closedAt) return `${span(Date.parse(alert.closedAt))}, then closed`;
  return `${span(nowMs)} so far`;
}
