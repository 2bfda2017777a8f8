import type { Knex } from 'knex';
import type pg from 'pg';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Backtest, BacktestSummary, Evidence } from '../../api/src/contracts/backtests.js';
import type { Loop, ModelVersion } from '../../api/src/contracts/registry.js';
import { createPgPool } from '../../api/src/lib/pg-pool.js';
import { createBacktestRunner, type BacktestRunner } from '../../api/src/workers/backtest-worker.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import {
  insertReadings,
  recordingCsv,
  recordModel,
  sendUpload,
  TANK_OPERATING_POINT,
  TANK_PLANT,
  waitForBacktest,
  type RecordedSlot,
} from '../helpers/backtest-fixtures.js';
import {
  act,
  createDraft,
  createLoop,
  ENGINEER,
  OPERATOR,
  REVIEWER,
  signedIn,
  type ErrorResponse,
} from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';
import { loopWithTwin, openDb, slotMsAgo } from '../helpers/twin-fixtures.js';

const stack = inject('stack');
let api: RunningApi;
let db: Knex;
let runnerDb: Knex;
let runnerPool: pg.Pool;
let runner: BacktestRunner;
let engineer: SessionClient;
let reviewer: SessionClient;
let operator: SessionClient;

/** The plant's true model and operating point. */
const OPERATING_POINT = TANK_OPERATING_POINT;
const TRUE_MODEL = TANK_PLANT;
/** The running version: 10 % more gain from the valve than the plant has. */
const ACTIVE_MODEL = { ...TRUE_MODEL, B: [[0], [0.33]] };
const KALMAN = {
  mode: 'kalman',
  Q: [
    [1e-4, 0],
    [0, 1e-4],
  ],
  R: [[1e-2]],
};

const SLOTS = 900;
/** Ten slots without a reading, inside one 50-slot input step (slots 400 … 449). */
const GAP = new Set(Array.from({ length: 10 }, (_, i) => 420 + i));

let loop: Loop;
let active: ModelVersion;
let candidate: ModelVersion;
let recorded: RecordedSlot[];
let range: { from: string; to: string };

const post = <T>(client: SessionClient, path: string, body: unknown) =>
  client.request<T>('POST', path, body, { csrf: true });
const backtestsOf = (loopId: string) => `/api/v1/loops/${loopId}/backtests`;

/** Runs the queued job with the worker's code, and waits for its end. */
async function runQueued(id: string): Promise<Backtest> {
  expect(await runner.runOnce()).toBe(id);
  return waitForBacktest(engineer, id, ['succeeded', 'failed', 'cancelled']);
}

beforeAll(async () => {
  // jobs are run by the test (createBacktestRunner, the worker's own code) so that queued jobs stay queued
  api = await startApi(stack, { BACKTEST_WORKERS: 'false' });
  db = openDb(stack.databaseUrl);
  runnerDb = openDb(stack.databaseUrl);
  runnerPool = createPgPool(stack.databaseUrl, 2);
  runner = createBacktestRunner({ db: runnerDb, pool: runnerPool, logger: pino({ level: 'silent' }) });
  engineer = await signedIn(api.url, ENGINEER);
  reviewer = await signedIn(api.url, REVIEWER);
  operator = await signedIn(api.url, OPERATOR);
  ({ loop, version: active } = await loopWithTwin(
    engineer,
    reviewer,
    { operatingPoint: OPERATING_POINT },
    ACTIVE_MODEL,
  ));
  candidate = await createDraft(engineer, loop.id, { ...TRUE_MODEL, correction: KALMAN });
  const firstK = Math.round(slotMsAgo(SLOTS + 60) / 1000);
  recorded = recordModel(
    { ...TRUE_MODEL, ...OPERATING_POINT },
    { firstK, slots: SLOTS, hold: 50, spread: 10, missing: GAP },
  );
  await insertReadings(db, loop.id, 1, recorded);
  range = { from: new Date(firstK * 1000).toISOString(), to: new Date((firstK + SLOTS) * 1000).toISOString() };
  // a tight band: the true model's residual is at rounding level, the active model's is not
  const band = { mode: 'absolute', limits: [0.05], raiseAfter: 3, clearAfter: 3, deadband: 0.1 };
  const saved = await engineer.request(
    'PUT',
    `/api/v1/loops/${loop.id}/drift-rules/band`,
    { enabled: true, priority: 2, params: band },
    { csrf: true },
  );
  expect(saved.status).toBe(200);
});

afterAll(async () => {
  await runnerPool.end();
  await runnerDb.destroy();
  await db.destroy();
  await api.close();
});

const measured = () => recorded.map((r) => r.y[0]);
const sum = (values: number[]) => values.reduce((a, b) => a + b, 0);

describe('a backtest over stored readings', () => {
  let backtest: Backtest;

  it('queues a job (202), runs it and keeps the results', async () => {
    const created = await post<{ id: string; status: string; upload: null }>(engineer, backtestsOf(loop.id), {
      versionIds: [active.id, candidate.id],
      ...range,
    });
    expect(created.status).toBe(202);
    expect(created.body).toMatchObject({ status: 'queued', upload: null });
    const queued = await engineer.request<Backtest>('GET', `/api/v1/backtests/${created.body.id}`);
    expect(queued.body).toMatchObject({ status: 'queued', progress: 0, source: 'range', results: null, ...range });
    expect(queued.body.versions.map((v) => v.number)).toEqual([1, 2]);
    backtest = await runQueued(created.body.id);
    expect(backtest).toMatchObject({ status: 'succeeded', progress: 1, error: null, loopTag: loop.tag });
    expect(backtest.startedAt).not.toBeNull();
    expect(backtest.finishedAt).not.toBeNull();
  });

  it('counts the slots: from the first reading to the last, with the gap missing', () => {
    expect(backtest.results?.samples).toEqual({ slots: SLOTS, measured: SLOTS - GAP.size, missing: GAP.size });
  });

  it('fits the version that generated the readings at 100 %, its residual negligible, with the correction it uses', () => {
    const figures = backtest.results!.versions[1];
    expect(figures).toMatchObject({
      versionId: candidate.id,
      versionNumber: 2,
      versionStatus: 'draft',
      wasActive: false,
      diverged: false,
    });
    expect(figures.oneStep.correction).toBe('kalman');
    expect(figures.freeRun.correction).toBe('free_run');
    for (const run of [figures.oneStep, figures.freeRun]) {
      const [level] = run.outputs;
      expect(level).toMatchObject({ name: 'Level', unit: 'm', scored: SLOTS - GAP.size });
      // the data are the model's own output: the fit is 100 % up to rounding (Ljung's normalised fit)
      expect(level.fitPercent).toBeGreaterThan(100 - 1e-6);
      expect(level.rmse).toBeLessThan(1e-9);
      expect(level.autocorrelation).toMatchObject({ negligible: true, white: true, lagsOutside: [] });
    }
  });

  it('reports the other version by the definitions of fit, RMSE, std and the whiteness band', () => {
    const figures = backtest.results!.versions[0];
    expect(figures).toMatchObject({ versionId: active.id, versionStatus: 'active', wasActive: true });
    // free_run correction: both runs predict the same (the contract's "then both runs agree")
    expect(figures.oneStep.outputs).toEqual(figures.freeRun.outputs);
    const [level] = figures.oneStep.outputs;
    const y = measured();
    const N = y.length;
    const mean = sum(y) / N;
    const spread = Math.sqrt(sum(y.map((v) => (v - mean) ** 2)));
    // fit = 100 (1 − ‖y − ŷ‖/‖y − ȳ‖) with ‖y − ŷ‖ = RMSE·√N (Ljung, System Identification, 2nd ed., §16.6)
    expect(level.fitPercent!).toBeCloseTo(100 * (1 - (level.rmse! * Math.sqrt(N)) / spread), 9);
    expect(level.fitPercent!).toBeLessThan(99);
    // sample variance identity: s² = N/(N−1) · (mean of squares − square of mean)
    expect(level.residualStd! ** 2).toBeCloseTo((N / (N - 1)) * (level.rmse! ** 2 - level.residualMean! ** 2), 9);
    // the 95 % whiteness band of N white residuals is ±1.96/√N (Ljung, §16.6)
    expect(level.autocorrelation!.band).toBeCloseTo(1.96 / Math.sqrt(N), 12);
    expect(level.autocorrelation!.correlation[0]).toBe(1);
  });

  it('replays the drift rules on the one-step residuals', () => {
    const [old, fresh] = backtest.results!.versions;
    const raises = (v: typeof old, kind: string) => v.replay.rules.find((r) => r.kind === kind)?.raises;
    // the true model never leaves the band; the gap of 10 slots is longer than the stale rule's 5
    expect(raises(fresh, 'band')).toBe(0);
    expect(raises(fresh, 'stale')).toBe(1);
    expect(raises(old, 'band')).toBeGreaterThan(0);
    for (const v of [old, fresh]) {
      expect(v.replay.total).toBe(sum(v.replay.rules.filter((r) => r.enabled).map((r) => r.raises)));
      expect(v.replay.days).toBeCloseTo(SLOTS / 86_400, 12);
      expect(v.replay.perDay).toBeCloseTo(v.replay.total / v.replay.days, 6);
      expect(v.replay.targetPerDay).toBe(144);
      expect(v.replay.alerts).toHaveLength(Math.min(v.replay.total, 200));
      for (const alert of v.replay.alerts) {
        expect(Date.parse(alert.raisedAt)).toBeGreaterThanOrEqual(Date.parse(range.from));
        expect(Date.parse(alert.raisedAt)).toBeLessThan(Date.parse(range.to));
      }
      expect(v.suggestion.sentence.length).toBeGreaterThan(0);
    }
  });

  it('compares candidate and active with a plain verdict', () => {
    const [old, fresh] = backtest.results!.versions;
    const comparison = backtest.results!.comparison!;
    expect(comparison).toMatchObject({
      candidateVersionId: candidate.id,
      activeVersionId: active.id,
      better: 'candidate',
      alertsCandidate: fresh.replay.total,
      alertsActive: old.replay.total,
    });
    expect(comparison.outputs[0].fitDelta).toBeCloseTo(
      fresh.oneStep.outputs[0].fitPercent! - old.oneStep.outputs[0].fitPercent!,
      9,
    );
    expect(comparison.verdict).toMatch(/Version 2/);
  });

  it('draws the chart from every reading (fewer than the chart holds), at the slot times', () => {
    const chart = backtest.results!.chart;
    expect(chart.t).toEqual(recorded.map((r) => r.k * 1000));
    expect(chart.measured).toEqual([measured()]);
    expect(chart.predictions.map((p) => p.versionId)).toEqual([active.id, candidate.id]);
    for (const p of chart.predictions) expect(p.oneStep[0]).toHaveLength(recorded.length);
  });

  it('lists the loop’s backtests newest first with the verdict, and answers 404 for an unknown one', async () => {
    const list = await operator.request<BacktestSummary[]>('GET', backtestsOf(loop.id));
    expect(list.status).toBe(200);
    expect(list.body[0]).toMatchObject({ id: backtest.id, verdict: backtest.results!.comparison!.verdict });
    expect(list.body[0]).not.toHaveProperty('results');
    const missing = await operator.request<ErrorResponse>(
      'GET',
      '/api/v1/backtests/3f1b8a5e-0000-4000-8000-000000000000',
    );
    expect(missing.status).toBe(404);
    expect(missing.body.error.message).toContain('Backtest 3f1b8a5e-0000-4000-8000-000000000000 was not found');
  });

  it('audits the creation', async () => {
    const entry = await db('audit_log').where({ action: 'backtest.created', target_id: backtest.id }).first();
    expect(entry?.details).toMatchObject({ loopId: loop.id, source: 'range', versionIds: [active.id, candidate.id] });
  });
});

describe('refusals when a backtest is asked for', () => {
  it('refuses operators (403), versions of another loop (422 naming it) and too few or too many slots', async () => {
    const body = { versionIds: [active.id], ...range };
    expect((await post(operator, backtestsOf(loop.id), body)).status).toBe(403);
    const other = await createLoop(engineer);
    const foreign = await createDraft(engineer, other.id);
    const wrong = await post<ErrorResponse>(engineer, backtestsOf(loop.id), {
      ...body,
      versionIds: [active.id, foreign.id],
    });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.message).toContain(`Model version ${foreign.id} belongs to another loop`);
    const short = { ...body, to: new Date(Date.parse(range.from) + 40_000).toISOString() };
    const few = await post<ErrorResponse>(engineer, backtestsOf(loop.id), short);
    expect(few.status).toBe(422);
    expect(few.body.error.message).toContain('holds 40 readings; a backtest needs at least 52');
    const long = { ...body, from: '2020-01-01T00:00:00Z', to: '2020-03-01T00:00:00Z' };
    const tooLong = await post<ErrorResponse>(engineer, backtestsOf(loop.id), long);
    expect(tooLong.status).toBe(422);
    expect(tooLong.body.error.message).toContain('spans 5,184,000 slots at 1 s');
    expect((await post(engineer, backtestsOf(loop.id), { ...body, versionIds: [] })).status).toBe(400);
  });
});

describe('a backtest over an uploaded CSV', () => {
  let uploaded: Backtest;

  it('checks the rows as an import does, reports a bad row by its line and keeps the rows out of readings', async () => {
    const before = await db('readings').where({ loop_id: loop.id }).count<{ count: string }[]>('* as count');
    // a year ago: older than any live reading, as an upload may be
    const yearAgo = recorded.map((r) => ({ ...r, k: r.k - 365 * 86_400 }));
    const csv = recordingCsv([...yearAgo, yearAgo[5]], 1, ['time', 'valve', 'level'])
      .split('\n')
      .map((line, i) => (i === 8 ? line.replace(/,[^,]*$/, ',n/a') : line))
      .join('\n');
    const response = await sendUpload<{ id: string; status: string; upload: Backtest['upload'] }>(
      engineer,
      backtestsOf(loop.id),
      csv,
      {
        versionIds: JSON.stringify([candidate.id]),
        mapping: JSON.stringify({ t: 'time', u: ['valve'], y: ['level'] }),
      },
    );
    expect(response.status).toBe(202);
    expect(response.body.upload).toEqual({
      fileName: 'recording.csv',
      rowsRead: yearAgo.length + 1,
      accepted: yearAgo.length - 1,
      duplicates: 1,
      rejected: 1,
      badRows: [{ line: 9, reason: 'y[0] (column "level") is not a finite number' }],
    });
    const after = await db('readings').where({ loop_id: loop.id }).count<{ count: string }[]>('* as count');
    expect(after).toEqual(before);
    expect(
      await db('backtest_samples').where({ backtest_id: response.body.id }).count<{ count: string }[]>('* as count'),
    ).toEqual([{ count: String(yearAgo.length - 1) }]);
    uploaded = await runQueued(response.body.id);
    expect(uploaded).toMatchObject({ status: 'succeeded', source: 'upload', from: null, to: null });
    expect(uploaded.results!.samples).toEqual({ slots: SLOTS, measured: SLOTS - GAP.size - 1, missing: GAP.size + 1 });
    expect(uploaded.results!.versions[0].oneStep.outputs[0].fitPercent).toBeGreaterThan(100 - 1e-6);
    expect(uploaded.results!.comparison).toBeNull();
  });

  it('names what is wrong with the fields and refuses a file with too few good rows', async () => {
    const csv = recordingCsv(recorded.slice(0, 30), 1, ['time', 'valve', 'level']);
    const mapping = JSON.stringify({ t: 'time', u: ['valve'], y: ['level'] });
    const noIds = await sendUpload<ErrorResponse>(engineer, backtestsOf(loop.id), csv, { versionIds: 'nope', mapping });
    expect(noIds.status).toBe(400);
    expect(noIds.body.error.message).toContain('versionIds must be a JSON array of version ids');
    const few = await sendUpload<ErrorResponse>(engineer, backtestsOf(loop.id), csv, {
      versionIds: JSON.stringify([candidate.id]),
      mapping,
    });
    expect(few.status).toBe(422);
    expect(few.body.error.message).toContain('holds 30 readings');
    expect(
      await db('backtests').where({ loop_id: loop.id, source: 'upload' }).count<{ count: string }[]>('* as count'),
    ).toEqual([{ count: '1' }]);
  });
});

describe('cancelling and the end of a job', () => {
  const queue = async () => {
    const created = await post<{ id: string }>(engineer, backtestsOf(loop.id), {
      versionIds: [candidate.id],
      ...range,
    });
    expect(created.status).toBe(202);
    return created.body.id;
  };
  const cancel = (id: string) => post<Backtest & ErrorResponse>(engineer, `/api/v1/backtests/${id}/cancel`, {});

  it('cancels a queued job at once, and refuses to cancel it twice (409)', async () => {
    const id = await queue();
    const cancelled = await cancel(id);
    expect(cancelled.status).toBe(200);
    expect(cancelled.body).toMatchObject({ status: 'cancelled', cancelRequested: true, results: null });
    expect((await cancel(id)).status).toBe(409);
    expect(await runner.runOnce()).toBeNull();
  });

  it('stops a running job at its next step and marks it cancelled, without results', async () => {
    const id = await queue();
    // hold the job after it read the recording: it waits for the alert settings while the cancel arrives
    const lock = await db.transaction();
    await lock.raw('LOCK TABLE alert_settings IN ACCESS EXCLUSIVE MODE');
    const run = runner.runOnce();
    try {
      await waitForBacktest(engineer, id, ['running']);
      const asked = await cancel(id);
      expect(asked.body).toMatchObject({ status: 'running', cancelRequested: true });
    } finally {
      await lock.rollback();
    }
    expect(await run).toBe(id);
    const ended = await waitForBacktest(engineer, id, ['cancelled']);
    expect(ended).toMatchObject({ status: 'cancelled', results: null });
    expect(ended.finishedAt).not.toBeNull();
  });

  it('fails with a clear error when the readings are gone by the time it runs', async () => {
    const other = await createLoop(engineer);
    const draft = await createDraft(engineer, other.id);
    const rows = recordModel(TRUE_MODEL, { firstK: recorded[0].k, slots: 60, hold: 20, spread: 5 });
    await insertReadings(db, other.id, 1, rows);
    const created = await post<{ id: string }>(engineer, backtestsOf(other.id), { versionIds: [draft.id], ...range });
    await db('readings').where({ loop_id: other.id }).del();
    const failed = await runQueued(created.body.id);
    expect(failed).toMatchObject({ status: 'failed', results: null });
    expect(failed.error).toBe(`The recording holds no readings between ${range.from} and ${range.to}.`);
  });

  it('re-runs a job whose worker went silent, and gives up after three attempts', async () => {
    const silent = async (attempts: number) => {
      const id = await queue();
      await db('backtests')
        .where({ id })
        .update({
          status: 'running',
          claimed_by: 'a-process-that-died',
          attempts,
          heartbeat_at: db.raw(`now() - interval '3 minutes'`),
        });
      return id;
    };
    const fresh = await queue();
    await db('backtests')
      .where({ id: fresh })
      .update({ status: 'running', claimed_by: 'a-live-process', heartbeat_at: db.fn.now(), attempts: 1 });
    const retried = await silent(1);
    expect(await runner.runOnce()).toBe(retried);
    expect(await waitForBacktest(engineer, retried, ['succeeded'])).toMatchObject({ status: 'succeeded' });
    expect(await db('backtests').where({ id: retried }).first('attempts')).toEqual({ attempts: 2 });
    const abandoned = await silent(3);
    expect(await runner.runOnce()).toBeNull();
    const given = await waitForBacktest(engineer, abandoned, ['failed']);
    expect(given.error).toContain('stopped 3 times');
    // a job with a recent heartbeat belongs to a live worker: left alone
    expect(await db('backtests').where({ id: fresh }).first('status')).toEqual({ status: 'running' });
    await db('backtests').where({ id: fresh }).update({ status: 'cancelled', finished_at: db.fn.now() });
  });
});

describe('evidence for a review', () => {
  const evidenceOf = (versionId: string) => `/api/v1/model-versions/${versionId}/evidence`;
  let rangeId: string;
  let uploadId: string;
  let cancelledId: string;

  beforeAll(async () => {
    const list = (await engineer.request<BacktestSummary[]>('GET', backtestsOf(loop.id))).body;
    rangeId = list.find((b) => b.source === 'range' && b.status === 'succeeded' && b.versions.length === 2)!.id;
    uploadId = list.find((b) => b.source === 'upload' && b.status === 'succeeded')!.id;
    cancelledId = list.find((b) => b.status === 'cancelled')!.id;
  });

  it('attaches a backtest (201), again without change (200), lists it with the verdict, detaches it (204)', async () => {
    const first = await post<Evidence>(engineer, evidenceOf(candidate.id), {
      backtestId: rangeId,
      note: 'fits better',
    });
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({
      backtestId: rangeId,
      versionId: candidate.id,
      note: 'fits better',
      source: 'range',
    });
    expect(first.body.version.versionId).toBe(candidate.id);
    expect(first.body.active?.versionId).toBe(active.id);
    const again = await post<Evidence>(engineer, evidenceOf(candidate.id), { backtestId: rangeId });
    expect(again.status).toBe(200);
    expect(again.body.note).toBe('fits better');
    const backtest = await engineer.request<Backtest>('GET', `/api/v1/backtests/${rangeId}`);
    expect(backtest.body.attachedTo).toEqual([{ versionId: candidate.id, versionNumber: 2 }]);
    expect(first.body.verdict).toBe(backtest.body.results!.comparison!.verdict);
    const own = await post<Evidence>(engineer, evidenceOf(candidate.id), { backtestId: uploadId });
    expect(own.body).toMatchObject({ fileName: 'recording.csv', active: null });
    expect(own.body.verdict).toMatch(/^Version 2 fits Level 100\.0 % one step ahead/);
    const listed = await operator.request<Evidence[]>('GET', evidenceOf(candidate.id));
    expect(listed.body.map((e) => e.backtestId)).toEqual([uploadId, rangeId]);
    for (const id of [rangeId, uploadId]) {
      const removed = await engineer.request('DELETE', `${evidenceOf(candidate.id)}/${id}`, undefined, { csrf: true });
      expect(removed.status).toBe(204);
    }
    expect((await engineer.request<Evidence[]>('GET', evidenceOf(candidate.id))).body).toEqual([]);
    const audit = await db('audit_log').where({ action: 'model_version.evidence_attached', target_id: candidate.id });
    expect(audit).toHaveLength(2);
  });

  it('refuses a backtest of another loop, one that did not succeed or did not replay the version, and an active version', async () => {
    const other = await createLoop(engineer);
    const foreign = await createDraft(engineer, other.id);
    await insertReadings(
      db,
      other.id,
      1,
      recordModel(TRUE_MODEL, { firstK: recorded[0].k, slots: 60, hold: 20, spread: 5 }),
    );
    const theirs = await post<{ id: string }>(engineer, backtestsOf(other.id), { versionIds: [foreign.id], ...range });
    const wrongLoop = await post<ErrorResponse>(engineer, evidenceOf(candidate.id), { backtestId: theirs.body.id });
    expect(wrongLoop.status).toBe(422);
    expect(wrongLoop.body.error.message).toContain(`replayed loop ${other.tag}, not ${loop.tag}`);
    const notDone = await post<ErrorResponse>(engineer, evidenceOf(candidate.id), { backtestId: cancelledId });
    expect(notDone.status).toBe(409);
    expect(notDone.body.error.message).toContain('is cancelled; only a backtest that succeeded');
    const closed = await post<ErrorResponse>(engineer, evidenceOf(active.id), { backtestId: rangeId });
    expect(closed.status).toBe(409);
    expect(closed.body.error.message).toContain(`Version 1 of ${loop.tag} is active`);
    const third = await createDraft(engineer, loop.id, TRUE_MODEL);
    const notIn = await post<ErrorResponse>(engineer, evidenceOf(third.id), { backtestId: uploadId });
    expect(notIn.status).toBe(422);
    expect(notIn.body.error.message).toContain('did not replay version 3');
    expect((await post(operator, evidenceOf(candidate.id), { backtestId: rangeId })).status).toBe(403);
    await engineer.request('POST', `/api/v1/backtests/${theirs.body.id}/cancel`, {}, { csrf: true });
  });

  it('submits with backtestIds in one step: all attached, or none and the version stays a draft', async () => {
    const refused = await act<ErrorResponse>(engineer, candidate.id, 'submit', { backtestIds: [rangeId, cancelledId] });
    expect(refused.status).toBe(409);
    expect((await engineer.request<ModelVersion>('GET', `/api/v1/model-versions/${candidate.id}`)).body.status).toBe(
      'draft',
    );
    expect((await engineer.request<Evidence[]>('GET', evidenceOf(candidate.id))).body).toEqual([]);
    const submitted = await act(engineer, candidate.id, 'submit', { backtestIds: [rangeId] });
    expect(submitted.status).toBe(200);
    expect(submitted.body.status).toBe('in_review');
    const seen = await reviewer.request<Evidence[]>('GET', evidenceOf(candidate.id));
    expect(seen.body.map((e) => [e.backtestId, e.verdict])).toEqual([[rangeId, expect.stringMatching(/Version 2/)]]);
    // the reviewer weighs the evidence and may neither add to it nor take from it (four eyes)
    const added = await post<ErrorResponse>(reviewer, evidenceOf(candidate.id), { backtestId: uploadId });
    expect(added.status).toBe(403);
    expect(added.body.error.message).toContain('Only the author of version 2');
    const taken = await reviewer.request('DELETE', `${evidenceOf(candidate.id)}/${rangeId}`, undefined, { csrf: true });
    expect(taken.status).toBe(403);
    expect((await reviewer.request<Evidence[]>('GET', evidenceOf(candidate.id))).body).toHaveLength(1);
    const audit = await db('audit_log').where({ action: 'model_version.submitted', target_id: candidate.id }).first();
    expect(audit?.details).toMatchObject({ backtestIds: [rangeId] });
  });
});

describe('the api process', () => {
  it('runs queued backtests by itself, and documents the routes in OpenAPI', async () => {
    const worker = await startApi(stack, { BACKTEST_POLL_INTERVAL_MS: '100' });
    try {
      const created = await post<{ id: string }>(engineer, backtestsOf(loop.id), { versionIds: [active.id], ...range });
      expect((await waitForBacktest(engineer, created.body.id, ['succeeded'])).status).toBe('succeeded');
    } finally {
      await worker.close();
    }
    const openApi = await operator.request<{ paths: Record<string, Record<string, unknown>> }>(
      'GET',
      '/api/v1/openapi.json',
    );
    expect(Object.keys(openApi.body.paths['/api/v1/loops/{loopId}/backtests'])).toEqual(['post', 'get']);
    // both ways in are documented: the JSON range and the multipart upload with its fields and file
    const create = openApi.body.paths['/api/v1/loops/{loopId}/backtests'].post as {
      requestBody: {
        content: Record<string, { schema: { properties: Record<string, unknown>; required?: string[] } }>;
      };
    };
    expect(Object.keys(create.requestBody.content)).toEqual(['application/json', 'multipart/form-data']);
    expect(create.requestBody.content['application/json'].schema.properties).toHaveProperty('from');
    const form = create.requestBody.content['multipart/form-data'].schema;
    expect(Object.keys(form.properties)).toEqual(['versionIds', 'mapping', 'file']);
    expect(form.properties.file).toMatchObject({ type: 'string', format: 'binary' });
    expect(form.required).toEqual(['versionIds', 'mapping', 'file']);
    for (const path of [
      '/api/v1/backtests/{id}',
      '/api/v1/backtests/{id}/cancel',
      '/api/v1/model-versions/{id}/evidence',
      '/api/v1/model-versions/{id}/evidence/{backtestId}',
    ])
      expect(openApi.body.paths).toHaveProperty([path]);
  });
});
