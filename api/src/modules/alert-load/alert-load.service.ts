import type { AlertLoad } from '../../contracts/alerts.js';
import type { Db } from '../../db/knex.js';
import { readAlertSettings } from '../oncall/alert-settings.js';
import {
  activationsPer10Min,
  activationsPerDay,
  chatteringAlerts,
  meanTimeToAcknowledge,
  staleAlerts,
  topLoops,
} from './alert-load.queries.js';
import { mergeFloods } from './flood-merge.js';
import { countWindows, resolveLoadRange } from './load-range.js';

/**
 * The alert-load report (ISA-18.2 / EEMUA 191 performance measures): activations per day and
 * per 10 minutes against the configured targets, floods, chattering and stale alerts, the loops
 * that raise most, and the mean time to acknowledge. Days are UTC calendar days.
 */
export async function buildAlertLoad(
  db: Db,
  query: { from?: string; to?: string },
  now: Date = new Date(),
): Promise<AlertLoad> {
  const range = resolveLoadRange(query, now);
  const staleAsOf = new Date(Math.min(range.to.getTime(), now.getTime()));
  const [settings, perDay, per10Min, chattering, stale, loops, mtta] = await Promise.all([
    readAlertSettings(db),
    activationsPerDay(db, range),
    activationsPer10Min(db, range),
    chatteringAlerts(db, range),
    staleAlerts(db, staleAsOf),
    topLoops(db, range),
    meanTimeToAcknowledge(db, range),
  ]);
  const windowCount = countWindows(range);
  const overTarget = per10Min.filter((w) => w.count > settings.targetPer10Min).length;
  return {
    from: range.from.toISOString(),
    to: range.to.toISOString(),
    targets: {
      perDay: settings.targetPerDay,
      per10Min: settings.targetPer10Min,
      floodPer10Min: settings.floodPer10Min,
    },
    perDay,
    per10Min,
    windowsOverTargetPercent: (100 * overTarget) / windowCount,
    floods: mergeFloods(per10Min, settings.floodPer10Min),
    chattering,
    stale,
    topLoops: loops,
    meanTimeToAcknowledgeS: mtta.meanS,
    acknowledgedAlerts: mtta.alerts,
    windowCount,
    staleAsOf: staleAsOf.toISOString(),
    total: per10Min.reduce((sum, w) => sum + w.count, 0),
  };
}
