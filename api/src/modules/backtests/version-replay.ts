import { setImmediate as yieldToEventLoop } from 'node:timers/promises';
import { outputFigures, startReplay, type OutputFigures } from '@shadowloop/simulator/replay';
import { BACKTEST_LIMITS, type VersionBacktest } from '../../contracts/backtests.js';
import type { Signal } from '../../contracts/registry.js';
import type { RuleInForce } from '../drift-rules/rule-runtime.js';
import type { ReplayVersion } from './backtest-versions.js';
import type { Recording } from './recording.js';
import { replayRules } from './rule-replay.js';
import { suggestRules } from './rule-suggestion.js';

/** Slots replayed between two yields to the event loop, so the api keeps answering requests. */
export const CHUNK_SLOTS = 20_000;

/** What every version of a backtest is replayed against. */
export interface ReplayContext {
  recording: Recording;
  samplePeriodS: number;
  outputs: Signal[];
  rules: RuleInForce[];
  targetPerDay: number;
}

/** A version's figures (status and activity are filled in when the job ends) and its predictions for the chart. */
export interface ReplayedVersion {
  figures: Omit<VersionBacktest, 'versionStatus' | 'wasActive'>;
  oneStep: Float64Array;
  freeRun: Float64Array;
}

const named = (figures: OutputFigures[], outputs: Signal[]) =>
  figures.map((f, i) => ({ name: outputs[i].name, unit: outputs[i].unit, ...f }));

/**
 * One version over the recording: both runs of the live twin's code (one step with the version's
 * correction, and free run) in chunks of CHUNK_SLOTS slots, their fit figures per output (Ljung,
 * System Identification, 2nd ed., 1999, §16.6), the loop's drift rules on the one-step residuals,
 * and rule settings suggested from their spread. `progress(fraction)` is called after each chunk.
 */
export async function replayVersion(
  version: ReplayVersion,
  ctx: ReplayContext,
  progress: (fraction: number) => Promise<void>,
): Promise<ReplayedVersion> {
  const { recording, outputs } = ctx;
  const replay = startReplay({ model: version.model, correction: version.correction }, recording);
  while (!replay.done) {
    replay.advance(CHUNK_SLOTS);
    await yieldToEventLoop();
    await progress(replay.fraction);
  }
  const result = replay.result();
  const p = recording.outputs;
  // the steps below are whole passes over the recording (a few hundred ms each at 604,800 slots):
  // the event loop gets a turn between them
  const oneStep = outputFigures(recording.y, result.oneStep, p, BACKTEST_LIMITS.maxLag);
  await yieldToEventLoop();
  const freeRun = outputFigures(recording.y, result.freeRun, p, BACKTEST_LIMITS.maxLag);
  await yieldToEventLoop();
  const replayed = replayRules({
    rules: ctx.rules,
    ctx: { outputs, samplePeriodS: ctx.samplePeriodS, innovationCovInverse: version.innovationCovInverse },
    k: recording.k,
    samplePeriodS: ctx.samplePeriodS,
    measured: recording.y,
    predicted: result.oneStep,
    outputs: p,
    targetPerDay: ctx.targetPerDay,
  });
  await yieldToEventLoop();
  const suggestion = suggestRules(
    oneStep.map((f) => ({ std: f.residualStd, scored: f.scored })),
    ctx.samplePeriodS,
  );
  return {
    figures: {
      versionId: version.id,
      versionNumber: version.number,
      oneStep: { mode: 'one_step', correction: result.correction, note: result.note, outputs: named(oneStep, outputs) },
      freeRun: { mode: 'free_run', correction: 'free_run', note: null, outputs: named(freeRun, outputs) },
      replay: replayed,
      suggestion,
      diverged: result.diverged,
    },
    oneStep: result.oneStep,
    freeRun: result.freeRun,
  };
}
