import type { Knex } from 'knex';
import type { IngestPrincipal } from '../../auth/ingest-principal.js';
import type { IngestResult } from '../../contracts/ingest.js';
import type { Db } from '../../db/knex.js';
import type { TwinPublisher } from '../../realtime/publisher.js';
import { forgetTrendMinutes } from '../series/trend-minutes.js';
import { foldReadings } from '../tracking/tracking-fold.js';
import { saveTracking } from '../tracking/tracking.repository.js';
import { requireRecentLiveLoop, type LiveLoop } from './live-loop.js';
import type { PartitionKeeper } from './partitions.js';
import { checkReading, type CheckedReading, type ReadingRules } from './reading-checks.js';
import { insertScoredReadings } from './readings.repository.js';
import { publishAlertChanges } from '../alerts/alerts.service.js';
import { announceBatch } from './announce.js';
import { checkDrift } from './drift-check.js';
import { utcDay } from './sample-grid.js';

export interface IngestDeps {
  db: Db;
  partitions: PartitionKeeper;
  publisher: TwinPublisher;
  futureToleranceS: number;
  maxAgeDays: number;
  /** Every batch waits for the commit's flush (INGEST_SYNCHRONOUS_COMMIT); see {@link commitDurably}. */
  synchronousCommit: boolean;
}

function rulesFor(target: LiveLoop, deps: IngestDeps, nowMs: number): ReadingRules {
  return {
    inputs: target.inputs,
    outputs: target.outputs,
    samplePeriodS: target.samplePeriodS,
    latestMs: nowMs + deps.futureToleranceS * 1000,
    earliestMs: nowMs - deps.maxAgeDays * 86_400_000,
    tooOldAdvice: `more than ${deps.maxAgeDays} days ago; upload history as a CSV file (POST …/readings/import)`,
  };
}

/** Good readings (first of each slot), duplicates within the batch, and the rejected ones with reasons. */
function sortBatch(items: unknown[], rules: ReadingRules) {
  const good: CheckedReading[] = [];
  const rejected: IngestResult['rejected'] = [];
  const slots = new Set<number>();
  let duplicates = 0;
  items.forEach((item, index) => {
    const check = checkReading(item, rules);
    if (!check.ok) rejected.push({ index, reason: check.reason });
    else if (slots.has(check.reading.k)) duplicates += 1;
    else {
      slots.add(check.reading.k);
      good.push(check.reading);
    }
  });
  return { good, rejected, duplicates };
}

/**
 * How the ingest transaction commits. A batch in which a drift rule raised or cleared (an alert
 * changed and its mail waits in the outbox, or a raise was recorded during maintenance) commits as
 * every other transaction does: the answer waits until the commit is on disk. A batch of readings
 * alone commits asynchronously: the answer does not wait for the write-ahead log's flush, which on
 * a busy or virtualised disk can stall for a second and would hold up every reading behind it. The
 * database stays consistent; only a crash of PostgreSQL itself (not of the api) can lose the last
 * fraction of a second of such batches (at most three times wal_writer_delay, 0.6 s by default),
 * and then readings, residuals and rule states roll back together, so the rules pick up from the
 * stored state with the next reading. Bridges that must never lose an acknowledged reading re-send
 * their last few readings: the ingest counts them as duplicates. INGEST_SYNCHRONOUS_COMMIT=true
 * makes every batch wait for the flush.
 */
async function commitDurably(trx: Knex.Transaction, ruleTransitions: number, synchronous: boolean): Promise<void> {
  if (ruleTransitions === 0 && !synchronous) await trx.raw('SET LOCAL synchronous_commit TO off');
}

/**
 * Stores a batch of readings: each is checked and slotted, the good ones are inserted once per slot,
 * scored against the twin's predictions, folded into the loop's tracking and judged by the loop's
 * drift rules (raising or clearing alerts, mail queued in the outbox), all in one transaction; then
 * the newest sample, a status change and alert changes go out to watching browsers.
 */
export async function ingestReadings(
  deps: IngestDeps,
  loopId: string,
  items: unknown[],
  principal?: IngestPrincipal,
): Promise<IngestResult> {
  const target = await requireRecentLiveLoop(deps.db, loopId);
  const nowMs = Date.now();
  const { good, rejected, duplicates } = sortBatch(items, rulesFor(target, deps, nowMs));
  if (!good.length) return { accepted: 0, duplicates, rejected };
  await deps.partitions.ensureDays(good.map((r) => utcDay(r.slotMs)));
  const outcome = await deps.db.transaction(async (trx) => {
    const { before, stored } = await insertScoredReadings(
      trx,
      { loopId: target.id, inputs: target.inputs, outputs: target.outputs, sourceId: principal?.sourceId ?? null },
      good,
    );
    if (!stored.length) return { before, after: before, stored, changes: [] };
    const folded = foldReadings(before, target, stored);
    const drift = await checkDrift(trx, target, before, folded, stored, new Date(nowMs));
    const { tracking: after, changes } = drift;
    await saveTracking(trx, target.id, after);
    await forgetTrendMinutes(trx, target, stored[0].slotMs, stored[stored.length - 1].slotMs);
    await commitDurably(trx, drift.transitions, deps.synchronousCommit);
    return { before, after, stored, changes };
  });
  if (outcome.stored.length) announceBatch(deps.publisher, target, outcome, nowMs);
  if (outcome.changes.length) await publishAlertChanges(deps.db, deps.publisher, outcome.changes);
  return { accepted: outcome.stored.length, duplicates: duplicates + good.length - outcome.stored.length, rejected };
}
