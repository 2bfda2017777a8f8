import { randomUUID } from 'node:crypto';
import { pipeline } from 'node:stream/promises';
import type { Request, Response } from 'express';
import Papa from 'papaparse';
import type pg from 'pg';
import type { SignedInUser } from '../../auth/user.js';
import { ImportFieldsSchema, INGEST_LIMITS, type ImportMapping, type ImportProgress } from '../../contracts/ingest.js';
import type { Db } from '../../db/knex.js';
import { AppError, badRequest } from '../../http/errors.js';
import { requireLiveLoop, type LiveLoop } from '../readings/live-loop.js';
import type { PartitionKeeper } from '../readings/partitions.js';
import type { CheckedReading, ReadingRules } from '../readings/reading-checks.js';
import { utcDay } from '../readings/sample-grid.js';
import { forgetTrendMinutes } from '../series/trend-minutes.js';
import { checkRow, planColumns, type ColumnPlan } from './csv-rows.js';
import { receiveCsv, type IncomingCsv } from './csv-upload.js';
import { insertImport, updateImport, type ProgressUpdate } from './import-progress.repository.js';
import { openImportWriter } from './import-writer.js';

export interface ImportDeps {
  db: Db;
  pool: pg.Pool;
  partitions: PartitionKeeper;
  futureToleranceS: number;
  maxFileBytes: number;
}

const CHUNK_ROWS = 20_000;

function parseFields(fields: Record<string, unknown>) {
  const parsed = ImportFieldsSchema.safeParse(fields);
  if (!parsed.success) {
    const details = parsed.error.issues.map((i) => ({ path: ['body', ...i.path].join('.'), message: i.message }));
    throw badRequest(
      `The import fields are not valid (send them before the file): ${details.map((d) => `${d.path}: ${d.message}`).join('; ')}`,
      details,
    );
  }
  return parsed.data;
}

type Writer = Awaited<ReturnType<typeof openImportWriter>>;

/** Collects checked rows and stores them chunk by chunk, updating the tally and the progress row. */
function chunkStore(
  deps: ImportDeps,
  loop: LiveLoop,
  id: string,
  csv: IncomingCsv,
  writer: Writer,
  tally: ProgressUpdate,
) {
  let chunk: { line: number; reading: CheckedReading }[] = [];
  const flush = async () => {
    if (csv.truncated())
      throw new AppError(
        413,
        'too_large',
        `The file is larger than ${Math.round(deps.maxFileBytes / 1024 / 1024)} MB; the rows before the limit were stored. Split the file.`,
      );
    if (!chunk.length) return;
    const slots = chunk.map((r) => r.reading.slotMs);
    await deps.partitions.ensureDays(slots.map(utcDay));
    const accepted = await writer.write(chunk);
    await forgetTrendMinutes(
      deps.db,
      loop,
      slots.reduce((a, b) => Math.min(a, b)),
      slots.reduce((a, b) => Math.max(a, b)),
    );
    Object.assign(tally, {
      accepted: tally.accepted + accepted,
      duplicates: tally.duplicates + chunk.length - accepted,
    });
    chunk = [];
    await updateImport(deps.db, id, tally);
  };
  return {
    flush,
    async add(line: number, reading: CheckedReading): Promise<void> {
      chunk.push({ line, reading });
      if (chunk.length >= CHUNK_ROWS) await flush();
    },
  };
}

/**
 * Reads the CSV row by row (papaparse on the upload stream), checks each row like a posted reading
 * and hands the good ones to the store; line 1 is the header.
 */
async function readRows(
  csv: IncomingCsv,
  mapping: ImportMapping,
  rules: ReadingRules,
  tally: ProgressUpdate,
  store: ReturnType<typeof chunkStore>,
) {
  let plan: ColumnPlan | undefined;
  let line = 0;
  await pipeline(csv.stream, Papa.parse(Papa.NODE_STREAM_INPUT, {}), async (rows: AsyncIterable<string[]>) => {
    for await (const row of rows) {
      line += 1;
      if (!plan)
        plan = planColumns(
          row.map((cell, i) => (i === 0 ? cell.replace(/^\uFEFF/, '') : cell)),
          mapping,
          rules,
        );
      else if (row.length > 1 || row[0].trim() !== '') {
        tally.rowsRead += 1;
        const check = checkRow(row, plan, rules);
        if (check.ok) await store.add(line, check.reading);
        else if (++tally.rejected <= INGEST_LIMITS.reportedBadRows) tally.badRows.push({ line, reason: check.reason });
      }
    }
  });
  if (!plan) throw badRequest('The file is empty: the first line must name the columns.');
}

async function runImport(
  deps: ImportDeps,
  loop: LiveLoop,
  id: string,
  csv: IncomingCsv,
  mapping: ImportMapping,
): Promise<ImportProgress> {
  const tally: ProgressUpdate = {
    rowsRead: 0,
    accepted: 0,
    duplicates: 0,
    rejected: 0,
    badRows: [],
    done: false,
    error: null,
  };
  const writer = await openImportWriter(deps.pool, loop.id);
  try {
    const store = chunkStore(deps, loop, id, csv, writer, tally);
    const rules: ReadingRules = {
      inputs: loop.inputs,
      outputs: loop.outputs,
      samplePeriodS: loop.samplePeriodS,
      latestMs: Date.now() + deps.futureToleranceS * 1000,
      earliestMs: -Infinity,
      tooOldAdvice: '',
    };
    await readRows(csv, mapping, rules, tally, store);
    await store.flush();
    await writer.close(false);
    return await updateImport(deps.db, id, { ...tally, done: true });
  } catch (error) {
    await writer.close(true);
    await updateImport(deps.db, id, { ...tally, done: true, error: (error as Error).message }).catch(() => undefined);
    throw error;
  }
}

/** POST …/readings/import: a multipart CSV with a column mapping; the answer is the finished import's tally. */
export async function importCsv(
  deps: ImportDeps,
  user: SignedInUser,
  loopId: string,
  req: Request,
  res: Response,
): Promise<ImportProgress> {
  const loop = await requireLiveLoop(deps.db, loopId);
  return receiveCsv(req, res, deps.maxFileBytes, async (csv) => {
    const fields = parseFields(csv.fields);
    const progress = await insertImport(deps.db, {
      id: fields.importId ?? randomUUID(),
      loopId: loop.id,
      userId: user.id,
      fileName: csv.fileName,
    });
    return runImport(deps, loop, progress.id, csv, fields.mapping);
  });
}
