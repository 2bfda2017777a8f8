import type { DriftRuleKind, Priority } from '../../contracts/alerts.js';
import type { Db } from '../../db/knex.js';
import { createTtlCache } from '../../lib/ttl-cache.js';
import { innovationCovInverseOf } from './innovation-covariance.js';
import { storedParams } from './rule-params.js';
import type { RuleInForce } from './rule-runtime.js';

/** A loop's drift rules as the evaluator runs them, with S⁻¹ of its active Kalman correction. */
export interface RuleSet {
  rules: RuleInForce[];
  innovationCovInverse: number[][] | null;
}

type RuleRaw = {
  id: string;
  kind: DriftRuleKind;
  enabled: boolean;
  priority: number;
  version: number;
  params: unknown;
};

/**
 * Reads the rule set now. Rules whose stored params no longer fit the loop (its outputs changed)
 * are left out: they could not be evaluated, and the rules page shows them for an engineer to fix.
 */
export async function loadRuleSet(db: Db, loopId: string): Promise<RuleSet> {
  // one query after the other: inside the ingest transaction both go through its one connection
  const loop = (await db('loops as l')
    .leftJoin('model_versions as v', (join) => join.on('v.loop_id', 'l.id').andOnVal('v.status', 'active'))
    .where('l.id', loopId)
    .first(db.raw('jsonb_array_length(l.outputs) AS outputs'), 'v.correction', 'v.c')) as
    { outputs: number; correction: unknown; c: unknown } | undefined;
  const rows = (await db('drift_rules')
    .where({ loop_id: loopId })
    .select('id', 'kind', 'enabled', 'priority', 'version', 'params')) as RuleRaw[];
  if (!loop) return { rules: [], innovationCovInverse: null };
  const rules: RuleInForce[] = [];
  for (const row of rows) {
    const params = storedParams(row.kind, row.params, loop.outputs);
    if (!params) continue;
    rules.push({
      id: row.id,
      kind: row.kind,
      enabled: row.enabled,
      priority: row.priority as Priority,
      version: row.version,
      params,
    });
  }
  const inverse = innovationCovInverseOf(loop.correction, loop.c);
  return { rules, innovationCovInverse: inverse && inverse.length === loop.outputs ? inverse : null };
}

/**
 * For the ingest, which evaluates a loop's rules many times a second: the rule set as read at most
 * RULE_SET_TTL_MS ago. A save in this process is seen at once ({@link forgetRuleSet}); other api
 * processes see it within the TTL.
 */
export const RULE_SET_TTL_MS = 5000;
const recent = createTtlCache<string, RuleSet>(RULE_SET_TTL_MS);

export async function recentRuleSet(db: Db, loopId: string): Promise<RuleSet> {
  const known = recent.get(loopId);
  if (known) return known;
  const ruleSet = await loadRuleSet(db, loopId);
  recent.set(loopId, ruleSet);
  return ruleSet;
}

export function forgetRuleSet(loopId: string): void {
  recent.delete(loopId);
}
