import { STABILITY_TOLERANCE } from '@shadowloop/simulator/engine';
import type { AlertDetail } from '../../contracts/alerts.js';
import type { RuleTransition } from '../drift-rules/rule-runtime.js';
import { decimalsFor, duration, quantity, samples } from './plain-words.js';

export interface Signal {
  name: string;
  unit: string;
}

/** What a raise's sentence can say beyond the transition itself. */
export interface SummaryContext {
  loopTag: string;
  outputs: Signal[];
  /** Consecutive samples a band or nis rule waited before raising, when known. */
  raiseAfter?: number | null;
  /** Per-output sigma of the rule (cusum), to pick the output that moved most. */
  sigma?: number[] | null;
  samplePeriodS?: number | null;
}

/** The values at the raise, per output with units (AlertDetailSchema). */
export function detailOf(transition: RuleTransition, outputs: Signal[]): AlertDetail {
  const pick = (values: number[] | null, i: number) => (values && Number.isFinite(values[i]) ? values[i] : null);
  return {
    statistic: transition.statistic.name,
    value: transition.statistic.value,
    limit: transition.statistic.limit,
    signals: outputs.map((signal, i) => ({
      name: signal.name,
      unit: signal.unit,
      measured: pick(transition.measured, i),
      predicted: pick(transition.predicted, i),
      residual: pick(transition.residual, i),
      limit: transition.limits ? (transition.limits[i] ?? null) : null,
    })),
    slotAt: new Date(transition.slotMs).toISOString(),
  };
}

/** Index of the output with the largest |r_i| / scale_i (scale 1 where unknown), or -1 without residuals. */
function worstOutput(residual: number[] | null, scale: (number | null)[] | null | undefined): number {
  if (!residual?.length) return -1;
  let worst = -1;
  let largest = -1;
  residual.forEach((r, i) => {
    const s = scale?.[i];
    if (scale && s === null) return;
    const ratio = Math.abs(r) / (s && s > 0 ? s : 1);
    if (Number.isFinite(ratio) && ratio > largest) [worst, largest] = [i, ratio];
  });
  return worst;
}

/** "DO measured 1.42 mg/L against 2.05 mg/L predicted" (or its residual when a value is missing). */
function readingText(transition: RuleTransition, signal: Signal, i: number, extra: (number | null)[] = []): string {
  const measured = transition.measured?.[i];
  const predicted = transition.predicted?.[i];
  const d = decimalsFor(measured, predicted, ...extra);
  if (measured != null && predicted != null) {
    return `${signal.name} measured ${quantity(measured, signal.unit, d)} against ${quantity(predicted, signal.unit, d)} predicted`;
  }
  const residual = transition.residual?.[i] ?? 0;
  return `${signal.name} is ${quantity(residual, signal.unit, decimalsFor(residual, ...extra))} off its prediction`;
}

function bandSentence(t: RuleTransition, ctx: SummaryContext): string {
  const i = worstOutput(t.residual, t.limits);
  const signal = ctx.outputs[i];
  if (!signal) return `The residual of ${ctx.loopTag} left its band (${t.statistic.value.toFixed(2)} × the limit).`;
  const limit = t.limits?.[i] ?? null;
  const persisted = ctx.raiseAfter ? ` for ${samples(ctx.raiseAfter)}` : '';
  const d = decimalsFor(t.measured?.[i], t.predicted?.[i], limit);
  const band = limit !== null ? ` (band ${quantity(limit, signal.unit, d)})` : '';
  const others = (t.residual ?? []).filter(
    (r, j) => j !== i && t.limits?.[j] && Math.abs(r) > (t.limits[j] as number),
  ).length;
  const more = others
    ? `, and ${others} other output${others === 1 ? ' is' : 's are'} outside ${others === 1 ? 'its' : 'their'} band`
    : '';
  return `${readingText(t, signal, i, [limit])}${persisted}${band}${more}.`;
}

function cusumSentence(t: RuleTransition, ctx: SummaryContext): string {
  const i = worstOutput(t.residual, ctx.sigma ?? null);
  const sums = `the CUSUM sum reached ${t.statistic.value.toFixed(1)} σ against the decision interval ${t.statistic.limit.toFixed(1)} σ`;
  const signal = ctx.outputs[i];
  if (!signal) return `The residual of ${ctx.loopTag} has shifted: ${sums}.`;
  return `${signal.name} has shifted from its prediction: ${sums} (${readingText(t, signal, i)}).`;
}

function nisSentence(t: RuleTransition, ctx: SummaryContext): string {
  const who =
    ctx.outputs.length === 1
      ? `The residual of ${ctx.outputs[0].name} is`
      : `The residuals of the ${ctx.outputs.length} outputs together are`;
  const persisted = ctx.raiseAfter ? ` for ${samples(ctx.raiseAfter)}` : '';
  return `${who} larger than the model allows: NIS ${t.statistic.value.toFixed(2)} above the chi-square limit ${t.statistic.limit.toFixed(2)}${persisted}.`;
}

function staleSentence(t: RuleTransition, ctx: SummaryContext): string {
  const missing = Math.round(t.statistic.value);
  const time = ctx.samplePeriodS ? ` (${duration(missing * ctx.samplePeriodS)})` : '';
  return `No reading from ${ctx.loopTag} for ${samples(missing)}${time}; the rule allows ${samples(Math.round(t.statistic.limit))}.`;
}

/** One plain sentence saying what happened at the raise. */
export function summaryOf(transition: RuleTransition, ctx: SummaryContext): string {
  switch (transition.kind) {
    case 'band':
      return bandSentence(transition, ctx);
    case 'cusum':
      return cusumSentence(transition, ctx);
    case 'nis':
      return nisSentence(transition, ctx);
    case 'stale':
      return staleSentence(transition, ctx);
  }
}

/** The model warning's sentence: the active version's own free response grows. */
export function unstableModelSentence(versionNumber: number, spectralRadius: number): string {
  const grows =
    spectralRadius > 1 + STABILITY_TOLERANCE
      ? `grows by about ${((spectralRadius - 1) * 100).toFixed(2)} % per sample`
      : 'grows without bound (a repeated mode on the unit circle)';
  return (
    `The active model itself diverges: version ${versionNumber} has spectral radius ${spectralRadius.toFixed(4)}, ` +
    `so its free response ${grows} and its predictions run away from the plant.`
  );
}
