import { parentPort, workerData } from 'node:worker_threads';
import type { ReplayVersion } from './backtest-versions.js';
import { replayVersion, type ReplayContext, type ReplayThreadMessage } from './version-replay.js';

/**
 * The worker thread of a backtest (started by replayVersions): replays each version and posts its
 * progress (at most about 50 reports per version) and then the results, handing the prediction
 * arrays over without a copy.
 */
const { versions, ctx } = workerData as { versions: ReplayVersion[]; ctx: ReplayContext };
const post = (message: ReplayThreadMessage, transfer: ArrayBuffer[] = []) => parentPort?.postMessage(message, transfer);
try {
  const replayed = versions.map((version, index) => {
    let reported = 0;
    return replayVersion(version, ctx, (fraction) => {
      if (fraction - reported < 0.02 && fraction < 1) return;
      reported = fraction;
      post({ type: 'progress', index, fraction });
    });
  });
  post(
    { type: 'done', replayed },
    replayed.flatMap((r) => [r.oneStep.buffer as ArrayBuffer, r.freeRun.buffer as ArrayBuffer]),
  );
} catch (error) {
  post({ type: 'failed', message: (error as Error).message });
}
