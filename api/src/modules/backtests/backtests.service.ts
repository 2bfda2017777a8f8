import type { SignedInUser } from '../../auth/user.js';
import {
  BACKTEST_LIMITS,
  type Backtest,
  type BacktestRangeBody,
  type BacktestSummary,
} from '../../contracts/backtests.js';
import type { Db } from '../../db/knex.js';
import { AppError, conflict, notFound } from '../../http/errors.js';
import { isUuid } from '../../http/params.js';
import { recordAudit } from '../audit/audit.repository.js';
import { requireLiveLoop } from '../readings/live-loop.js';
import { slotTimeMs } from '../readings/sample-grid.js';
import { requireLoopVersions } from './backtest-versions.js';
import {
  findBacktest,
  insertBacktest,
  listLoopBacktests,
  requestCancel,
  type NewBacktest,
} from './backtests.repository.js';

/** Readings a backtest needs at least: the autocorrelation's lags on both sides of the residual. */
export const MIN_READINGS = 2 * BACKTEST_LIMITS.maxLag + 2;
const LIST_LIMIT = 50;
const count = (n: number) => n.toLocaleString('en-GB');

/** Doubles a backtest holds per slot: the slot, inputs and outputs, two replays per version. */
export const valuesPerSlot = (loop: { inputs: number; outputs: number; versions: number }) =>
  1 + loop.inputs + loop.outputs * (1 + 2 * loop.versions);

/**
 * 422 when a recording of `slots` slots is longer than a backtest takes: more than maxSamples
 * slots, or more than maxValues values in memory (see {@link valuesPerSlot}).
 */
export function requireSlotLimit(
  slots: number,
  loop: { samplePeriodS: number; inputs: number; outputs: number; versions: number },
  what: string,
): void {
  const { samplePeriodS } = loop;
  const fitting = Math.min(BACKTEST_LIMITS.maxSamples, Math.floor(BACKTEST_LIMITS.maxValues / valuesPerSlot(loop)));
  if (slots <= fitting) return;
  const days = (fitting * samplePeriodS) / 86_400;
  const versions = loop.versions === 1 ? '1 version' : `${loop.versions} versions`;
  const limit =
    fitting < BACKTEST_LIMITS.maxSamples
      ? `a backtest holds at most ${count(BACKTEST_LIMITS.maxValues)} values in memory (per slot its inputs and ` +
        `outputs and two replays of the outputs per version), which for this loop's ${loop.inputs + loop.outputs} ` +
        `signals and ${versions} is ${count(fitting)} slots`
      : `a backtest takes at most ${count(BACKTEST_LIMITS.maxSamples)} slots`;
  throw new AppError(
    422,
    'recording_too_long',
    `${what} spans ${count(slots)} slots at ${samplePeriodS} s; ${limit} (${days.toFixed(1)} days at this ` +
      'sample period). Shorten it.',
  );
}

/** 422 when a recording holds too few readings for the figures. */
export function requireEnoughReadings(readings: number, what: string): void {
  if (readings >= MIN_READINGS) return;
  throw new AppError(
    422,
    'too_few_readings',
    `${what} holds ${count(readings)} reading${readings === 1 ? '' : 's'}; a backtest needs at least ${MIN_READINGS} ` +
      `(twice the ${BACKTEST_LIMITS.maxLag} autocorrelation lags, plus 2).`,
  );
}

/** The slots of [from, to) on the loop's sample grid. */
const slotsBetween = (fromMs: number, toMs: number, samplePeriodS: number) => {
  const periodMs = slotTimeMs(1, samplePeriodS);
  return Math.ceil(toMs / periodMs) - Math.ceil(fromMs / periodMs);
};

/** The audit entry of a new backtest; call it in the transaction that inserts the job. */
export async function auditCreation(
  trx: Db,
  actor: SignedInUser,
  loop: { id: string; tag: string },
  id: string,
  job: NewBacktest,
): Promise<void> {
  await recordAudit(trx, {
    actor,
    action: 'backtest.created',
    targetType: 'backtest',
    targetId: id,
    details: {
      loopId: loop.id,
      loopTag: loop.tag,
      versionIds: job.versionIds,
      source: job.upload ? 'upload' : 'range',
      ...(job.range ?? {}),
      ...(job.upload ? { fileName: job.upload.fileName, accepted: job.upload.accepted } : {}),
    },
  });
}

/** POST …/backtests with a range of stored readings. */
export async function createRangeBacktest(db: Db, actor: SignedInUser, loopId: string, body: BacktestRangeBody) {
  const loop = await requireLiveLoop(db, loopId);
  await requireLoopVersions(db, loop, body.versionIds);
  const fromMs = Date.parse(body.from);
  const toMs = Date.parse(body.to);
  const what = `The range ${new Date(fromMs).toISOString()} … ${new Date(toMs).toISOString()}`;
  requireSlotLimit(slotsBetween(fromMs, toMs, loop.samplePeriodS), { ...loop, versions: body.versionIds.length }, what);
  const [{ readings }] = await db('readings')
    .where('loop_id', loop.id)
    .where('slot_at', '>=', new Date(fromMs))
    .where('slot_at', '<', new Date(toMs))
    .count<{ readings: string }[]>('* as readings');
  requireEnoughReadings(Number(readings), `${what} of ${loop.tag}`);
  const range = { from: new Date(fromMs).toISOString(), to: new Date(toMs).toISOString() };
  const job = { loopId: loop.id, versionIds: body.versionIds, createdBy: actor.id, range };
  const id = await db.transaction(async (trx) => {
    const inserted = await insertBacktest(trx, job);
    await auditCreation(trx, actor, loop, inserted, job);
    return inserted;
  });
  return { id, status: 'queued' as const, upload: null };
}

export async function getBacktest(db: Db, id: string): Promise<Backtest> {
  const backtest = isUuid(id) ? await findBacktest(db, id) : undefined;
  if (!backtest) throw notFound(`Backtest ${id}`);
  return backtest;
}

export async function listBacktests(db: Db, loopId: string): Promise<BacktestSummary[]> {
  const loop = await requireLiveLoop(db, loopId);
  return listLoopBacktests(db, loop.id, LIST_LIMIT);
}

/** queued → cancelled at once; running → asked to stop; finished → 409. */
export async function cancelBacktest(db: Db, actor: SignedInUser, id: string): Promise<Backtest> {
  const before = await getBacktest(db, id);
  const status = await requestCancel(db, before.id);
  if (status !== 'queued' && status !== 'running')
    throw conflict(
      `Backtest ${id} has already ${status === 'succeeded' ? 'succeeded' : `ended (${status})`}; there is nothing to cancel.`,
    );
  await recordAudit(db, {
    actor,
    action: 'backtest.cancelled',
    targetType: 'backtest',
    targetId: id,
    details: { loopId: before.loopId, loopTag: before.loopTag, wasStatus: status },
  });
  return getBacktest(db, id);
}
