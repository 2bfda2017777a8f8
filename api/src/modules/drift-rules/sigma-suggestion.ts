import type { DriftRuleSuggestion } from '../../contracts/alerts.js';
import type { Signal } from '../../contracts/registry.js';
import type { Db } from '../../db/knex.js';
import { MIN_RESIDUALS_FOR_BAND, type ResidualStatistics } from '../tracking/residual-statistics.js';
import { readResidualStatistics } from './rule-loop.repository.js';
import { requireRuleLoop } from './drift-rules.service.js';

const threeFigures = (v: number) => Number(v.toPrecision(3));

/**
 * Sigma per output from running residual statistics (Welford's mean and M2): the sample standard
 * deviation √(M2/(n−1)), once MIN_RESIDUALS_FOR_BAND residuals have been seen. Pure.
 */
export function suggestionOf(stats: ResidualStatistics, outputs: Signal[]): DriftRuleSuggestion {
  const usable = stats.mean.length === outputs.length && stats.m2.length === outputs.length;
  const enough = usable && stats.count >= MIN_RESIDUALS_FOR_BAND;
  const rows = outputs.map((signal, i) => {
    const sd = enough ? Math.sqrt(stats.m2[i] / (stats.count - 1)) : NaN;
    return {
      name: signal.name,
      unit: signal.unit,
      mean: usable && stats.count > 0 ? threeFigures(stats.mean[i]) : null,
      sigma: sd > 0 && Number.isFinite(sd) ? threeFigures(sd) : null,
    };
  });
  const complete = rows.every((row) => row.sigma !== null);
  const count = usable ? stats.count : 0;
  const sentence = !enough
    ? `Sigma is suggested once the twin has scored ${MIN_RESIDUALS_FOR_BAND} readings; it has ${count} so far.`
    : `From ${count.toLocaleString('en-GB')} residuals since the twin began scoring readings. A period with a fault in it inflates these values; check them against a quiet stretch of the trend.`;
  return {
    residualCount: count,
    minimumCount: MIN_RESIDUALS_FOR_BAND,
    outputs: rows,
    sigma: complete ? rows.map((row) => row.sigma as number) : null,
    sentence,
  };
}

export async function suggestSigma(db: Db, loopId: string): Promise<DriftRuleSuggestion> {
  const loop = await requireRuleLoop(db, loopId);
  return suggestionOf(await readResidualStatistics(db, loop.id), loop.outputs);
}
