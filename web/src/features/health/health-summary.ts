import type { StatusTone } from '../../components/ui/status-word';
import { formatAgo } from '../../lib/format-time';
import type { HealthCheck, HealthReport } from './api/get-health';

export const CHECK_LABELS: Record<string, string> = {
  database: 'Database',
  mail: 'Mail server',
  identityProvider: 'Identity provider',
  simulator: 'Simulator',
};

export type HealthSummary = { tone: StatusTone; word: string };

export function summariseHealth(
  report: (HealthReport & { httpStatus: number }) | undefined,
  failed: boolean,
): HealthSummary {
  if (failed) return { tone: 'stale', word: 'No answer' };
  if (!report) return { tone: 'stale', word: 'Checking' };
  if (report.httpStatus === 503 || report.checks.database?.ok === false)
    return { tone: 'diverged', word: 'Services down' };
  if (report.status === 'degraded') return { tone: 'drifting', word: 'Services degraded' };
  return { tone: 'in_step', word: 'Services OK' };
}

export function describeCheck(name: string, check: HealthCheck): string {
  const label = CHECK_LABELS[name] ?? name;
  const state = check.ok ? 'ok' : 'not ok';
  const extras: string[] = [];
  if (check.detail) extras.push(check.detail);
  if (name === 'simulator') extras.push(`last beat ${formatAgo(check.lastBeatAt)}`);
  return extras.length > 0 ? `${label}: ${state} (${extras.join('; ')})` : `${label}: ${state}`;
}
