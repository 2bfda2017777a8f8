import type { Logger } from 'pino';
import type { Db } from '../../db/knex.js';
import { utcDay } from './sample-grid.js';

const DAY_MS = 86_400_000;
const UPKEEP_MS = 3_600_000;

async function ensureRange(db: Db, fromDay: string, toDay: string): Promise<void> {
  const run = () => db.raw('SELECT shadowloop_ensure_day_partitions(?::date, ?::date)', [fromDay, toDay]);
  // Another process may create the same day at the same moment: the second attempt finds it.
  await run().catch((error: { code?: string }) => {
    if (error.code === '42P07' || error.code === '23505') return run();
    throw error;
  });
}

/**
 * The readings and predictions tables have one partition per UTC day. Days this process has
 * ensured are remembered, so a batch costs a query only when it reaches a new day.
 */
export function createPartitionKeeper(db: Db) {
  const known = new Set<string>();

  async function ensureDays(days: Iterable<string>): Promise<void> {
    for (const day of new Set(days)) {
      if (known.has(day)) continue;
      await ensureRange(db, day, day);
      known.add(day);
    }
  }

  /** Yesterday to a week ahead, now and every hour; returns a stop function. */
  function startUpkeep(logger: Logger): () => void {
    const upkeep = async () => {
      const now = Date.now();
      await ensureRange(db, utcDay(now - DAY_MS), utcDay(now + 7 * DAY_MS));
      for (let d = -1; d <= 7; d++) known.add(utcDay(now + d * DAY_MS));
    };
    const run = () => void upkeep().catch((error: Error) => logger.error({ err: error }, 'partition upkeep failed'));
    run();
    const timer = setInterval(run, UPKEEP_MS);
    timer.unref();
    return () => clearInterval(timer);
  }

  return { ensureDays, startUpkeep };
}

export type PartitionKeeper = ReturnType<typeof createPartitionKeeper>;
