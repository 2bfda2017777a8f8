import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Request, Response } from 'express';
import type { Knex } from 'knex';
import type pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import type { SignedInUser } from '../../auth/user.js';
import { BacktestUploadFieldsSchema } from '../../contracts/backtests.js';
import type { ImportMapping } from '../../contracts/ingest.js';
import type { Db } from '../../db/knex.js';
import { AppError } from '../../http/errors.js';
import { importRules, readCheckedRows } from '../imports/checked-rows.js';
import { parseUploadFields, receiveCsv, type IncomingCsv } from '../imports/csv-upload.js';
import type { LiveLoop } from '../readings/live-loop.js';
import type { CheckedReading, ReadingRules } from '../readings/reading-checks.js';
import { requireLoopVersions } from './backtest-versions.js';
import { insertBacktest, type UploadTally } from './backtests.repository.js';
import { auditCreation, requireEnoughReadings, requireSlotLimit } from './backtests.service.js';

export interface UploadDeps {
  db: Db;
  futureToleranceS: number;
  maxFileBytes: number;
}

const CHUNK_ROWS = 20_000;

/** One row in COPY text format (numbers need no escaping). */
const copyLine = (line: number, r: CheckedReading) => `${line}\t${r.k}\t{${r.u.join(',')}}\t{${r.y.join(',')}}\n`;

/**
 * Writes checked rows of an upload into backtest_samples through the transaction's connection: COPY
 * a chunk into a staging table, insert it in line order so that the first row of a slot wins
 * (later ones count as duplicates), empty the staging table.
 */
async function openSampleWriter(trx: Knex.Transaction, backtestId: string) {
  // the transaction's own connection (knex hands it out while the transaction is open): COPY needs the pg client
  const client = (await trx.client.acquireConnection()) as pg.PoolClient;
  await client.query(
    'CREATE TEMP TABLE backtest_upload_rows (line bigint, k bigint, u float8[], y float8[]) ON COMMIT DROP',
  );
  return async (rows: { line: number; reading: CheckedReading }[]): Promise<number> => {
    await pipeline(
      Readable.from([rows.map((r) => copyLine(r.line, r.reading)).join('')]),
      client.query(copyFrom('COPY backtest_upload_rows (line, k, u, y) FROM STDIN')),
    );
    const { rowCount } = await client.query(
      `INSERT INTO backtest_samples (backtest_id, k, u, y)
       SELECT $1::uuid, k, u, y FROM backtest_upload_rows ORDER BY line ON CONFLICT DO NOTHING`,
      [backtestId],
    );
    await client.query('TRUNCATE backtest_upload_rows');
    return rowCount ?? 0;
  };
}

/** Streams the CSV through the import's column plan and row checks into the writer, chunk by chunk. */
async function readUpload(
  csv: IncomingCsv,
  mapping: ImportMapping,
  rules: ReadingRules,
  tally: UploadTally,
  write: (rows: { line: number; reading: CheckedReading }[]) => Promise<number>,
  limits: { maxFileBytes: number; versions: number },
): Promise<{ firstK: number; lastK: number }> {
  const { maxFileBytes } = limits;
  let chunk: { line: number; reading: CheckedReading }[] = [];
  const span = { firstK: Infinity, lastK: -Infinity };
  const flush = async () => {
    if (csv.truncated())
      throw new AppError(413, 'too_large', `The file is larger than ${Math.round(maxFileBytes / 1024 / 1024)} MB.`);
    if (!chunk.length) return;
    const accepted = await write(chunk);
    tally.accepted += accepted;
    tally.duplicates += chunk.length - accepted;
    chunk = [];
    requireSlotLimit(
      span.lastK - span.firstK + 1,
      { ...rules, versions: limits.versions },
      `The file "${tally.fileName}"`,
    );
  };
  await readCheckedRows(csv, mapping, rules, tally, async (line, reading) => {
    span.firstK = Math.min(span.firstK, reading.k);
    span.lastK = Math.max(span.lastK, reading.k);
    chunk.push({ line, reading });
    if (chunk.length >= CHUNK_ROWS) await flush();
  });
  await flush();
  return span;
}

/**
 * POST …/backtests as multipart/form-data: the fields versionIds and mapping, then the CSV file.
 * Rows are checked as a readings import checks them and stored apart from the live readings; the
 * job, its samples and its audit entry commit together, so a failed upload leaves nothing behind.
 */
export async function createUploadBacktest(
  deps: UploadDeps,
  actor: SignedInUser,
  loop: LiveLoop,
  req: Request,
  res: Response,
) {
  return receiveCsv(req, res, deps.maxFileBytes, async (csv) => {
    const fields = parseUploadFields(
      BacktestUploadFieldsSchema,
      csv.fields,
      'The backtest fields are not valid (send versionIds and mapping before the file)',
    );
    await requireLoopVersions(deps.db, loop, fields.versionIds);
    const tally: UploadTally = {
      fileName: csv.fileName,
      rowsRead: 0,
      accepted: 0,
      duplicates: 0,
      rejected: 0,
      badRows: [],
    };
    const rules = importRules(loop, deps.futureToleranceS);
    const id = await deps.db.transaction(async (trx) => {
      const job = { loopId: loop.id, versionIds: fields.versionIds, createdBy: actor.id, upload: tally };
      const backtestId = await insertBacktest(trx, job);
      const write = await openSampleWriter(trx, backtestId);
      await readUpload(csv, fields.mapping, rules, tally, write, {
        maxFileBytes: deps.maxFileBytes,
        versions: fields.versionIds.length,
      });
      requireEnoughReadings(tally.accepted, `The file "${tally.fileName}"`);
      await trx('backtests')
        .where({ id: backtestId })
        .update({ upload: JSON.stringify(tally) });
      await auditCreation(trx, actor, loop, backtestId, job);
      return backtestId;
    });
    return { id, status: 'queued' as const, upload: tally };
  });
}
