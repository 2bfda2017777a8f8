import type { BacktestStatus, Evidence, VersionBacktest } from '../../contracts/backtests.js';
import type { Db } from '../../db/knex.js';
import { ownFiguresVerdict } from './evidence-verdict.js';

type Raw = {
  version_id: string;
  backtest_id: string;
  note: string | null;
  attached_by: string | null;
  attacher_name: string | null;
  attached_at: Date;
  source: 'range' | 'upload';
  range_from: Date | null;
  range_to: Date | null;
  file_name: string | null;
  versions: VersionBacktest[];
  verdict: string | null;
};

const iso = (d: Date | null) => (d ? d.toISOString() : null);

function toEvidence(r: Raw): Evidence {
  const version = r.versions.find((v) => v.versionId === r.version_id) as VersionBacktest;
  return {
    backtestId: r.backtest_id,
    versionId: r.version_id,
    note: r.note,
    attachedBy: r.attached_by ? { id: r.attached_by, name: r.attacher_name ?? '' } : null,
    attachedAt: r.attached_at.toISOString(),
    verdict: r.verdict ?? ownFiguresVerdict(version),
    source: r.source,
    from: iso(r.range_from),
    to: iso(r.range_to),
    fileName: r.file_name,
    version,
    active: r.versions.find((v) => v.wasActive) ?? null,
  };
}

/** Evidence of a version, newest first; of each backtest only its figures and verdict are read (not the chart). */
export async function listEvidence(db: Db, versionId: string, backtestId?: string): Promise<Evidence[]> {
  const rows = (await db('model_version_evidence as e')
    .join('backtests as b', 'b.id', 'e.backtest_id')
    .leftJoin('users as u', 'u.id', 'e.attached_by')
    .where('e.version_id', versionId)
    .modify((q) => {
      if (backtestId) q.where('e.backtest_id', backtestId);
    })
    .orderBy('e.attached_at', 'desc')
    .select(
      'e.version_id',
      'e.backtest_id',
      'e.note',
      'e.attached_by',
      'u.name as attacher_name',
      'e.attached_at',
      'b.source',
      'b.range_from',
      'b.range_to',
      db.raw(`b.upload->>'fileName' AS file_name`),
      db.raw(`b.results->'versions' AS versions`),
      db.raw(`b.results->'comparison'->>'verdict' AS verdict`),
    )) as Raw[];
  return rows.map(toEvidence);
}

/** What attaching needs to know of a backtest. */
export interface EvidenceCandidate {
  id: string;
  loopId: string;
  loopTag: string;
  status: BacktestStatus;
  versionIds: string[];
}

export async function findEvidenceCandidate(db: Db, backtestId: string): Promise<EvidenceCandidate | undefined> {
  const row = (await db('backtests as b')
    .join('loops as l', 'l.id', 'b.loop_id')
    .where('b.id', backtestId)
    .first('b.id', 'b.loop_id', 'l.tag', 'b.status', 'b.version_ids')) as
    { id: string; loop_id: string; tag: string; status: BacktestStatus; version_ids: string[] } | undefined;
  return row && { id: row.id, loopId: row.loop_id, loopTag: row.tag, status: row.status, versionIds: row.version_ids };
}

/** Inserts the link; false when it was there already. */
export async function insertEvidence(
  db: Db,
  link: { versionId: string; backtestId: string; note: string | null; attachedBy: string },
): Promise<boolean> {
  const inserted = await db('model_version_evidence')
    .insert({
      version_id: link.versionId,
      backtest_id: link.backtestId,
      note: link.note,
      attached_by: link.attachedBy,
    })
    .onConflict(['version_id', 'backtest_id'])
    .ignore()
    .returning('version_id');
  return inserted.length > 0;
}

export async function deleteEvidence(db: Db, versionId: string, backtestId: string): Promise<boolean> {
  return (await db('model_version_evidence').where({ version_id: versionId, backtest_id: backtestId }).del()) > 0;
}
