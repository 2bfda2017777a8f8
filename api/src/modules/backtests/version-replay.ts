import { outputFigures, startReplay, type OutputFigures } from '@shadowloop/simulator/replay';
import { BACKTEST_LIMITS, type VersionBacktest } from '../../contracts/backtests.js';
import type { Signal } from '../../contracts/registry.js';
import { siblingModule, startModuleThread } from '../../lib/module-thread.js';
import type { RuleInForce } from '../drift-rules/rule-runtime.js';
import type { ReplayVersion } from './backtest-versions.js';
import type { Recording } from './recording.js';
import { replayRules } from './rule-replay.js';
import { suggestRules } from './rule-suggestion.js';

/** Slots replayed between two progress reports. */
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
 * and rule settings suggested from their spread. `onChunk(fraction)` is called after each chunk.
 * Synchronous and CPU-bound: it runs in a worker thread (see replayVersions).
 */
export function replayVersion(
  version: ReplayVersion,
  ctx: ReplayContext,
  onChunk: (fraction: number) => void,
): ReplayedVersion {
  const { recording, outputs } = ctx;
  const replay = startReplay({ model: version.model, correction: version.correction }, recording);
  while (!replay.done) {
    replay.advance(CHUNK_SLOTS);
    onChunk(replay.fraction);
  }
  const result = replay.result();
  const p = recording.outputs;
  const oneStep = outputFigures(recording.y, result.oneStep, p, BACKTEST_LIMITS.maxLag);
  const freeRun = outputFigures(recording.y, result.freeRun, p, BACKTEST_LIMITS.maxLag);
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
  const suggestion = suggestRules(
    oneStep.map((f) => ({ std: f.residualStd, scored: f.scored })),
    ctx.samplePeriodS,
    outputs.map((signal) => signal.name),
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

/** Messages of the replay thread (replay-thread.ts). */
export type ReplayThreadMessage =
  | { type: 'progress'; index: number; fraction: number }
  | { type: 'done'; replayed: ReplayedVersion[] }
  | { type: 'failed'; message: string };

/**
 * Replays the versions one after another in a worker thread, so that a long backtest (seconds of
 * arithmetic at a week of 1 s samples) never holds up the api's event loop: requests, the readings
 * ingest and alert raising go on meanwhile. `progress(index, fraction)` is awaited for each report
 * of the thread; when it throws (the job was cancelled or taken away) the thread is stopped and the
 * error passed on.
 */
export function replayVersions(
  versions: ReplayVersion[],
  ctx: ReplayContext,
  progress: (index: number, fraction: number) => Promise<void>,
): Promise<ReplayedVersion[]> {
  const thread = startModuleThread(siblingModule(import.meta.url, 'replay-thread'), { versions, ctx });
  return new Promise((resolve, reject) => {
    let settled = false;
    const settle = (outcome: () => void) => {
      if (settled) return;
      settled = true;
      outcome();
      void thread.terminate();
    };
    let reporting = Promise.resolve();
    thread.on('message', (message: ReplayThreadMessage) => {
      if (message.type === 'progress') {
        reporting = reporting
          .then(() => progress(message.index, message.fraction))
          .catch((error: unknown) => settle(() => reject(error as Error)));
      } else if (message.type === 'done') {
        void reporting.then(() => settle(() => resolve(message.replayed)));
      } else {
        settle(() => reject(new Error(message.message)));
      }
    });
    thread.on('error', (error) => settle(() => reject(error)));
    thread.on('exit', (code) => settle(() => reject(new Error(`the replay thread stopped (exit code ${code})`))));
  });
}
