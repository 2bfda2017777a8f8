import { z } from 'zod';
import {
  BacktestUploadFieldsSchema,
  BACKTEST_LIMITS,
  BacktestCreatedSchema,
  BacktestRangeBodySchema,
  BacktestSchema,
  BacktestSummarySchema,
} from '../../contracts/backtests.js';
import type { Config } from '../../config/config.js';
import type { Db } from '../../db/knex.js';
import { badRequest } from '../../http/errors.js';
import type { RouteTable } from '../../http/route.js';
import { requireLiveLoop } from '../readings/live-loop.js';
import { createUploadBacktest } from './backtest-upload.js';
import { cancelBacktest, createRangeBacktest, getBacktest, listBacktests, MIN_READINGS } from './backtests.service.js';
import { registerEvidenceRoutes } from './evidence.routes.js';

const TAG = 'backtests';

/** Backtests of model versions over recorded data, and backtests attached to versions as evidence. */
export function registerBacktestRoutes(routes: RouteTable, deps: { db: Db; config: Config }): void {
  const { db, config } = deps;
  const upload = {
    db,
    futureToleranceS: config.INGEST_FUTURE_TOLERANCE_S,
    maxFileBytes: config.IMPORT_MAX_FILE_MB * 1024 * 1024,
  };

  routes.add(
    {
      method: 'post',
      path: '/api/v1/loops/:loopId/backtests',
      access: ['engineer'],
      tag: TAG,
      status: 202,
      summary:
        `Queue a backtest of 1–${BACKTEST_LIMITS.maxVersions} versions of the loop as a background job; answers its id (follow it at GET /api/v1/backtests/{id}). ` +
        `Either JSON {"versionIds","from","to"} over the stored readings with from ≤ slot time < to, or multipart/form-data with the fields ` +
        `"versionIds" (a JSON array) and "mapping" (JSON, as for a readings import) and then the CSV "file": its rows are checked as an import checks them ` +
        `and kept apart from the live readings (the tally and the first bad rows with their line come back). At most ${BACKTEST_LIMITS.maxSamples.toLocaleString('en-GB')} ` +
        `slots, at most ${BACKTEST_LIMITS.maxValues.toLocaleString('en-GB')} values in memory (per slot the inputs, outputs and two replays of the outputs per version) and at least ${MIN_READINGS} readings (422 otherwise); ` +
        'versions of another loop: 422',
      body: BacktestRangeBodySchema.optional(),
      multipart: { fields: BacktestUploadFieldsSchema, file: 'file' },
      response: BacktestCreatedSchema,
    },
    async ({ req, res, user, body }) => {
      const loopId = String(req.params.loopId);
      if (req.is('multipart/form-data'))
        return createUploadBacktest(upload, user, await requireLiveLoop(db, loopId), req, res);
      if (!body)
        throw badRequest(
          'Send JSON {"versionIds": […], "from": …, "to": …}, or multipart/form-data with versionIds, mapping and the CSV file.',
        );
      return createRangeBacktest(db, user, loopId, body);
    },
  );

  routes.add(
    {
      method: 'get',
      path: '/api/v1/loops/:loopId/backtests',
      access: 'signed-in',
      tag: TAG,
      summary: "The loop's newest 50 backtests, newest first, without results (with the comparison's verdict)",
      response: z.array(BacktestSummarySchema),
    },
    ({ req }) => listBacktests(db, String(req.params.loopId)),
  );

  routes.add(
    {
      method: 'get',
      path: '/api/v1/backtests/:id',
      access: 'signed-in',
      tag: TAG,
      summary:
        'A backtest: status (queued, running, succeeded, failed, cancelled), progress 0 … 1 and stage; once it succeeded, per version and output fit %, RMSE, ' +
        'residual mean and std, residual autocorrelation with the whiteness band (one step ahead and free run), the drift rules replayed, suggested rule settings, ' +
        'the comparison of candidate and active version and the chart',
      response: BacktestSchema,
    },
    ({ req }) => getBacktest(db, String(req.params.id)),
  );

  routes.add(
    {
      method: 'post',
      path: '/api/v1/backtests/:id/cancel',
      access: ['engineer'],
      tag: TAG,
      summary:
        'Cancel a backtest: a queued one ends at once, a running one stops at its next progress step (cancelRequested until then); 409 once it has ended',
      response: BacktestSchema,
    },
    ({ req, user }) => cancelBacktest(db, user, String(req.params.id)),
  );

  registerEvidenceRoutes(routes, db);
}
