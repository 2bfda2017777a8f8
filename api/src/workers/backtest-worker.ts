import { hostname } from 'node:os';
import { randomUUID } from 'node:crypto';
import type pg from 'pg';
import type { Logger } from 'pino';
import type { Config } from '../config/config.js';
import type { Db } from '../db/knex.js';
import { AppError } from '../http/errors.js';
import { createPgPool } from '../lib/pg-pool.js';
import { runBacktest, type ProgressReport } from '../modules/backtests/backtest-job.js';
import {
  claimJob,
  finishJob,
  releaseJob,
  requeueSilentJobs,
  writeProgress,
  type ClaimedJob,
} from '../modules/backtests/backtest-jobs.repository.js';

/** Progress, stage and heartbeat are written at most this often; each write checks for a cancel. */
export const PROGRESS_INTERVAL_MS = 500;

export interface BacktestRunner {
  /** Re-queues jobs of dead workers, then claims and runs one queued job; its id, or null when none waited. */
  runOnce(): Promise<string | null>;
}

export interface BacktestWorker extends BacktestRunner {
  stop(): Promise<void>;
}

/** Thrown from the progress report to end a run: cancelled, or taken over after a long silence. */
class RunStopped extends Error {
  constructor(readonly reason: 'cancel' | 'lost' | 'shutdown') {
    super(`the backtest run stopped (${reason})`);
  }
}

const failureOf = (error: unknown) =>
  error instanceof AppError ? error.message : `The backtest failed: ${(error as Error).message ?? String(error)}`;

function throttledReport(db: Db, job: ClaimedJob, workerId: string, stopping: () => boolean): ProgressReport {
  let lastWrite = 0;
  return async (progress, stage) => {
    if (stopping()) throw new RunStopped('shutdown');
    if (Date.now() - lastWrite < PROGRESS_INTERVAL_MS) return;
    lastWrite = Date.now();
    const answer = await writeProgress(db, job.id, workerId, progress, stage);
    if (answer !== 'go') throw new RunStopped(answer);
  };
}

/** Claims and runs jobs for one worker id; no timer (the bench and the tests call runOnce). */
export function createBacktestRunner(deps: {
  db: Db;
  pool: pg.Pool;
  logger: Logger;
  workerId?: string;
  /** True once the process shuts down: the running job goes back to the queue at its next report. */
  stopping?: () => boolean;
}): BacktestRunner {
  const { db, pool, logger } = deps;
  const stopping = deps.stopping ?? (() => false);
  const workerId = deps.workerId ?? `${hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`;
  return {
    async runOnce() {
      const requeued = await requeueSilentJobs(db);
      if (requeued) logger.warn({ requeued }, 'backtests of a stopped worker were put back in the queue (or given up)');
      const job = await claimJob(db, workerId);
      if (!job) return null;
      try {
        const results = await runBacktest({ db, pool }, job, throttledReport(db, job, workerId, stopping));
        await finishJob(db, job.id, workerId, { results });
      } catch (error) {
        if (error instanceof RunStopped) {
          if (error.reason === 'cancel') await finishJob(db, job.id, workerId, { cancelled: true });
          if (error.reason === 'shutdown') await releaseJob(db, job.id, workerId);
          return job.id;
        }
        if (!(error instanceof AppError)) logger.error({ err: error, backtestId: job.id }, 'backtest failed');
        await finishJob(db, job.id, workerId, { failed: failureOf(error) });
      }
      return job.id;
    },
  };
}

/**
 * The backtest worker of an api process: every BACKTEST_POLL_INTERVAL_MS it runs the queued jobs
 * one after another. Every api process may run one; claims use row locks (FOR UPDATE SKIP LOCKED),
 * so no job runs twice, and a job whose process died is re-queued by the next worker that looks.
 */
export function startBacktestWorker(deps: { db: Db; pool?: pg.Pool; config: Config; logger: Logger }): BacktestWorker {
  const { db, config, logger } = deps;
  const ownPool = deps.pool ? null : createPgPool(config.DATABASE_URL, 2);
  let running: Promise<unknown> | null = null;
  let stopped = false;
  const runner = createBacktestRunner({
    db,
    pool: deps.pool ?? (ownPool as pg.Pool),
    logger,
    stopping: () => stopped,
  });
  const drain = async () => {
    while (!stopped && (await runner.runOnce()) !== null);
  };
  const tick = () => {
    if (stopped || running) return;
    running = drain()
      .catch((error: unknown) =>
        logger.error({ err: error }, 'backtest worker pass failed; retrying at the next interval'),
      )
      .finally(() => {
        running = null;
      });
  };
  const timer = setInterval(tick, config.BACKTEST_POLL_INTERVAL_MS);
  timer.unref();
  return {
    runOnce: () => runner.runOnce(),
    stop: async () => {
      stopped = true;
      clearInterval(timer);
      await running;
      await ownPool?.end();
    },
  };
}
