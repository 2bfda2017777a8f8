import type { Knex } from 'knex';
import { insertRule, insertRuleVersion } from './drift-rules.repository.js';

/**
 * The rules a new loop starts with, inside its creation transaction: `stale` after the loop's
 * stale_after_samples, priority 3, enabled. Band, CUSUM and NIS need each output's residual
 * standard deviation, which a new loop does not have yet; the rule editor suggests it once
 * residuals have come in.
 */
export async function insertDefaultRules(trx: Knex.Transaction, loopId: string, userId: string | null): Promise<void> {
  const loop = (await trx('loops').where({ id: loopId }).first('stale_after_samples')) as
    { stale_after_samples: number } | undefined;
  if (!loop) throw new Error(`insertDefaultRules: loop ${loopId} does not exist in this transaction`);
  const content = { enabled: true, priority: 3 as const, params: { afterSamples: loop.stale_after_samples } };
  const rule = await insertRule(trx, { ...content, loopId, kind: 'stale', userId });
  if (!rule) return;
  await insertRuleVersion(trx, {
    ...content,
    ruleId: rule.id,
    version: 1,
    note: 'Default rule of a new loop.',
    userId,
  });
}
