import { randomUUID } from 'node:crypto';
import type { Request, Response } from 'express';
import type pg from 'pg';
import type { SignedInUser } from '../../auth/user.js';
import { ImportFieldsSchema, type ImportMapping, type ImportProgress } from '../../contracts/ingest.js';
import type { Db } from '../../db/knex.js';
import { AppError } from '../../http/errors.js';
import { requireLiveLoop, type LiveLoop } from '../readings/live-loop.js';
import type { PartitionKeeper } from '../readings/partitions.js';
import type { CheckedReading } from '../readings/reading-checks.js';
import { utcDay } from '../readings/sample-grid.js';
import { forgetTrendMinutes } from '../series/trend-minutes.js';
import { importRules, readCheckedRows } from './checked-rows.js';
import { parseUploadFields, receiveCsv, type IncomingCsv } from './csv-upload.js';
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
    const rules = importRules(loop, deps.futureToleranceS);
    await readCheckedRows(csv, mapping, rules, tally, store.add);
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
    const fields = parseUploadFields(
      ImportFieldsSchema,
      csv.fields,
      'The import fields are not valid (send them before the file)',
    );
    const progress = await insertImport(deps.db, {
      id: fields.importId ?? randomUUID(),
      loopId: loop.id,
      userId: user.id,
      fileName: csv.fileName,
    });
    return runImport(deps, loop, progress.id, csv, fields.mapping);
  });
}
