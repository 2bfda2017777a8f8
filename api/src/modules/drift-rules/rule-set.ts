import type { DriftRuleKind, Priority } from '../../contracts/alerts.js';
import type { Db } from '../../db/knex.js';
import { createTtlCache } from '../../lib/ttl-cache.js';
import { innovationCovInverseOf } from './innovation-covariance.js';
import { storedParams } from './rule-params.js';
import type { RuleInForce, RuleModel } from './rule-runtime.js';

/** A loop's drift rules as the evaluator runs them, with S⁻¹ of its active Kalman correction. */
export interface RuleSet {
  rules: RuleInForce[];
  innovationCovInverse: number[][] | null;
  /** The active model version the set was read with (what a raise records and explains), or null. */
  model: RuleModel | null;
}

type LoopRaw = {
  outputs: number;
  correction: unknown;
  c: RuleModel['C'];
  version_id: string | null;
  number: number;
  a: RuleModel['A'];
  sample_period_s: number;
  analysis: RuleModel['analysis'];
};

const modelOf = (row: LoopRaw): RuleModel | null =>
  row.version_id === null
    ? null
    : {
        id: row.version_id,
        number: row.number,
        A: row.a,
        C: row.c,
        samplePeriodS: row.sample_period_s,
        analysis: row.analysis,
      };

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
  // one query (inside the ingest transaction it goes through its one connection): the loop, its
  // active version and its rules, the rules as one JSON array
  const loop = (await db('loops as l')
    .leftJoin('model_versions as v', (join) => join.on('v.loop_id', 'l.id').andOnVal('v.status', 'active'))
    .where('l.id', loopId)
    .first(
      db.raw('jsonb_array_length(l.outputs) AS outputs'),
      'v.correction',
      'v.c',
      'v.id as version_id',
      'v.number',
      'v.a',
      'v.sample_period_s',
      'v.analysis',
      db.raw(`(SELECT coalesce(json_agg(json_build_object('id', r.id, 'kind', r.kind, 'enabled', r.enabled,
        'priority', r.priority, 'version', r.version, 'params', r.params)), '[]') FROM drift_rules r
        WHERE r.loop_id = l.id) AS rules`),
    )) as (LoopRaw & { rules: RuleRaw[] }) | undefined;
  if (!loop) return { rules: [], innovationCovInverse: null, model: null };
  const rules: RuleInForce[] = [];
  for (const row of loop.rules) {
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
  return {
    rules,
    innovationCovInverse: inverse && inverse.length === loop.outputs ? inverse : null,
    model: modelOf(loop),
  };
}

/**
 * For the ingest, which evaluates a loop's rules many times a second: the rule set as read at most
 * RULE_SET_TTL_MS ago. A rule save or an activation clears it in every api process when it
 * commits (a cache notice, api/src/lib/cache-notice.ts); the time limit is the safety net.
 */
export const RULE_SET_TTL_MS = 60_000;
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
