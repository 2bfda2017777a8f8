import type { Db } from '../../db/knex.js';
import type { AlertChange } from '../alerts/alerts.service.js';
import { evaluateStale } from '../drift-rules/rule-evaluation.js';
import { recentRuleSet } from '../drift-rules/rule-set.js';
import { lockTracking, saveTracking } from '../tracking/tracking.repository.js';
import { applyToAlerts } from './drift-check.js';
import { findLiveLoop, TWIN_RUNNING_SQL } from './live-loop.js';

/**
 * Loops whose readings stopped: an enabled `stale` rule, a running twin, at least one reading ever
 * (a loop never connected is being commissioned, not stale), the newest older than the rule's
 * afterSamples sample periods, and the rule not raised yet.
 */
const DUE_SQL = `
SELECT l.id FROM loops l
JOIN drift_rules r ON r.loop_id = l.id AND r.kind = 'stale' AND r.enabled
JOIN loop_tracking lt ON lt.loop_id = l.id
WHERE ${TWIN_RUNNING_SQL}
  AND lt.last_reading_at IS NOT NULL
  AND lt.last_reading_at < ?::timestamptz - make_interval(secs => (r.params->>'afterSamples')::float8 * l.sample_period_s)
  AND NOT coalesce((lt.rule_state -> r.id::text ->> 'raised')::boolean, false)
LIMIT 500`;

/**
 * Raises the stale rule of every loop whose readings stopped (readings clear it again, in the
 * ingest). Each loop in its own transaction with its tracking row locked, so the ingest and other
 * api processes sweeping at the same time see one raise.
 */
export async function sweepStaleLoops(db: Db, now = new Date()): Promise<AlertChange[]> {
  const { rows } = (await db.raw(DUE_SQL, [now.toISOString()])) as { rows: { id: string }[] };
  const changes: AlertChange[] = [];
  for (const { id } of rows) {
    const made = await db.transaction(async (trx) => {
      const tracking = await lockTracking(trx, id);
      const loop = await findLiveLoop(trx, id);
      const ruleSet = await recentRuleSet(trx, id);
      const rule = ruleSet.rules.find((r) => r.kind === 'stale' && r.enabled);
      if (!loop || !rule) return [];
      const { state, transition } = evaluateStale(rule, tracking.ruleStates[rule.id], {
        lastReadingMs: tracking.lastReadingMs,
        lastSlotMs: tracking.lastSlotMs,
        nowMs: now.getTime(),
        samplePeriodS: loop.samplePeriodS,
      });
      await saveTracking(trx, id, { ...tracking, ruleStates: { ...tracking.ruleStates, [rule.id]: state } });
      if (!transition) return [];
      return applyToAlerts(trx, loop, ruleSet, tracking, [transition], now);
    });
    changes.push(...made);
  }
  return changes;
}
