import { formatDuration } from '../../../lib/format-number';

type Timed = { active: boolean; raisedAt: string; clearedAt: string | null };

/** How long the condition has lasted: up to now while active, up to its clearing once cleared. */
export function conditionDuration(alert: Timed, nowMs: number): string {
  const raised = Date.parse(alert.raisedAt);
  const end = alert.active || !alert.clearedAt ? nowMs : Date.parse(alert.clearedAt);
  const text = formatDuration(Math.max(0, (end - raised) / 1000));
  return alert.active || !alert.clearedAt ? `${text} so far` : `${text}, then cleared`;
}
