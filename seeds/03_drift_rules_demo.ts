import type { Knex } from 'knex';
import type { DriftRuleKind, Priority } from '../api/src/contracts/alerts.js';
import { insertRule, insertRuleVersion } from '../api/src/modules/drift-rules/drift-rules.repository.js';
import { parseRuleParams } from '../api/src/modules/drift-rules/rule-params.js';
import { DEMO_LOOPS, type DemoLoop } from './registry-demo/quillmere-loops.js';

const ENGINEER = 'engineer@quillmere.example';

export interface DemoRule {
  kind: DriftRuleKind;
  enabled: boolean;
  priority: Priority;
  params: Record<string, unknown>;
}

const threeFigures = (v: number) => Number(v.toPrecision(3));

/**
 * The drift rules of one demo loop. Sigma is a third of the loop's residual band (given to the
 * band rule too, so that the editor can show its false-alert interval). The CUSUM is
 * set for shifts of about the band (k = 1.5σ, h = 3σ) rather than 1σ: the free-running twins'
 * residuals are autocorrelated and carry a small bias from the plant's mismatch, and a CUSUM with
 * k = 0.5σ, h = 5σ on them raised several false alerts a day in simulated healthy operation, while
 * raising the aeration fouling only 10–20 s sooner. NIS runs where the active version has a
 * Kalman correction (its innovation covariance); elsewhere it is there, switched off.
 */
export function demoRules(loop: Pick<DemoLoop, 'residualBand'>, kalman: boolean): DemoRule[] {
  const sigma = loop.residualBand.map((band) => threeFigures(band / 3));
  return [
    {
      kind: 'band',
      enabled: true,
      priority: 2,
      params: { mode: 'absolute', limits: loop.residualBand, sigma, raiseAfter: 3, clearAfter: 5, deadband: 0.2 },
    },
    { kind: 'cusum', enabled: true, priority: 2, params: { k: 1.5, h: 3, sigma, shift: 3 } },
    {
      kind: 'nis',
      enabled: kalman,
      priority: 3,
      params: { falseAlarmProbability: 0.001, raiseAfter: 3, clearAfter: 5, sigma },
    },
    { kind: 'stale', enabled: true, priority: 1, params: { afterSamples: 5 } },
  ];
}

type LoopRow = { id: string; outputs: number; correction_mode: string | null };

/**
 * Drift rules for the Quillmere demo loops (seeds/02_registry_demo.ts). Idempotent: only the kinds
 * a loop does not have yet are added, so rules people have changed stay as they are.
 */
export async function seed(knex: Knex): Promise<void> {
  await knex.transaction(async (trx) => {
    const engineer = (await trx('users').where({ email: ENGINEER }).first('id')) as { id: string } | undefined;
    for (const loop of DEMO_LOOPS) {
      const row = (await trx('loops as l')
        .leftJoin('model_versions as v', (join) => join.on('v.loop_id', 'l.id').andOnVal('v.status', 'active'))
        .where('l.tag', loop.tag)
        .first(
          'l.id',
          trx.raw('jsonb_array_length(l.outputs) AS outputs'),
          trx.raw(`v.correction->>'mode' AS correction_mode`),
        )) as LoopRow | undefined;
      if (!row) continue;
      const existing = new Set((await trx('drift_rules').where({ loop_id: row.id }).pluck('kind')) as string[]);
      for (const rule of demoRules(loop, row.correction_mode === 'kalman')) {
        if (existing.has(rule.kind)) continue;
        const params = parseRuleParams(rule.kind, rule.params, row.outputs) as Record<string, unknown>;
        const content = { enabled: rule.enabled, priority: rule.priority, params };
        const userId = engineer?.id ?? null;
        const created = await insertRule(trx, { ...content, loopId: row.id, kind: rule.kind, userId });
        if (!created) continue;
        await insertRuleVersion(trx, { ...content, ruleId: created.id, version: 1, note: 'Demo rule.', userId });
      }
    }
  });
}
