import type { ImportProgress } from '../../contracts/ingest.js';
import type { Db } from '../../db/knex.js';
import { conflict } from '../../http/errors.js';

type Raw = {
  id: string;
  loop_id: string;
  file_name: string;
  rows_read: string;
  accepted: string;
  duplicates: string;
  rejected: string;
  bad_rows: ImportProgress['badRows'];
  done: boolean;
  error: string | null;
  started_at: Date;
  finished_at: Date | null;
};

const toProgress = (r: Raw): ImportProgress => ({
  id: r.id,
  loopId: r.loop_id,
  fileName: r.file_name,
  rowsRead: Number(r.rows_read),
  accepted: Number(r.accepted),
  duplicates: Number(r.duplicates),
  rejected: Number(r.rejected),
  badRows: r.bad_rows,
  done: r.done,
  error: r.error,
  startedAt: r.started_at.toISOString(),
  finishedAt: r.finished_at ? r.finished_at.toISOString() : null,
});

export async function insertImport(
  db: Db,
  row: { id: string; loopId: string; userId: string; fileName: string },
): Promise<ImportProgress> {
  const [inserted] = await db('reading_imports')
    .insert({ id: row.id, loop_id: row.loopId, created_by: row.userId, file_name: row.fileName })
    .returning<Raw[]>('*')
    .catch((error: { code?: string }) => {
      if (error.code === '23505') throw conflict(`An import with id ${row.id} already exists; send a new importId.`);
      throw error;
    });
  return toProgress(inserted);
}

export type ProgressUpdate = Pick<
  ImportProgress,
  'rowsRead' | 'accepted' | 'duplicates' | 'rejected' | 'badRows' | 'done' | 'error'
>;

export async function updateImport(db: Db, id: string, p: ProgressUpdate): Promise<ImportProgress> {
  const [row] = await db('reading_imports')
    .where({ id })
    .update({
      rows_read: p.rowsRead,
      accepted: p.accepted,
      duplicates: p.duplicates,
      rejected: p.rejected,
      bad_rows: JSON.stringify(p.badRows),
      done: p.done,
      error: p.error,
      ...(p.done ? { finished_at: db.fn.now() } : {}),
    })
    .returning<Raw[]>('*');
  return toProgress(row);
}

export async function findImport(db: Db, id: string): Promise<ImportProgress | undefined> {
  const row = (await db('reading_imports').where({ id }).first()) as Raw | undefined;
  return row && toProgress(row);
}
