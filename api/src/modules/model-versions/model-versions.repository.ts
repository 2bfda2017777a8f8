import type { Matrix, ModelAnalysis } from '@shadowloop/simulator/engine';
import type { ModelVersion, ModelVersionStatus } from '../../contracts/registry.js';
import type { Db } from '../../db/knex.js';
import type { PreparedModel } from './model-input.js';

/** A model version with what the service needs besides the API fields. */
export interface VersionRecord extends Omit<ModelVersion, 'analysis'> {
  analysis: ModelAnalysis;
  loopTag: string;
  samplePeriodS: number;
  authorId: string | null;
  approvedAgainstVersionId: string | null;
}

type Raw = {
  id: string;
  loop_id: string;
  loop_tag: string;
  number: number;
  status: ModelVersionStatus;
  sample_period_s: number;
  a: Matrix;
  b: Matrix;
  c: Matrix | null;
  d: Matrix | null;
  continuous: ModelVersion['continuous'];
  correction: ModelVersion['correction'];
  change_note: string;
  justification: string | null;
  analysis: ModelAnalysis;
  author_id: string | null;
  approved_against_version_id: string | null;
  review_note: string | null;
  reject_reason: string | null;
  created_at: Date;
  submitted_at: Date | null;
  reviewed_at: Date | null;
  activated_at: Date | null;
  retired_at: Date | null;
  author_email: string | null;
  author_name: string | null;
  reviewer_email: string | null;
  reviewer_name: string | null;
  activator_email: string | null;
  activator_name: string | null;
};

const iso = (d: Date | null) => (d ? d.toISOString() : null);
const person = (email: string | null, name: string | null) => (email ? { email, name: name ?? email } : null);

function selectVersions(db: Db) {
  return db('model_versions as v')
    .join('loops as l', 'l.id', 'v.loop_id')
    .leftJoin('users as au', 'au.id', 'v.author_id')
    .leftJoin('users as rv', 'rv.id', 'v.reviewer_id')
    .leftJoin('users as ac', 'ac.id', 'v.activated_by')
    .select(
      'v.*',
      'l.tag as loop_tag',
      'au.email as author_email',
      'au.name as author_name',
      'rv.email as reviewer_email',
      'rv.name as reviewer_name',
      'ac.email as activator_email',
      'ac.name as activator_name',
    );
}

const toVersion = (r: Raw): VersionRecord => ({
  id: r.id,
  loopId: r.loop_id,
  loopTag: r.loop_tag,
  number: r.number,
  status: r.status,
  samplePeriodS: r.sample_period_s,
  A: r.a,
  B: r.b,
  C: r.c,
  D: r.d,
  continuous: r.continuous,
  correction: r.correction,
  changeNote: r.change_note,
  justification: r.justification,
  analysis: r.analysis,
  authorId: r.author_id,
  approvedAgainstVersionId: r.approved_against_version_id,
  author: person(r.author_email, r.author_name),
  reviewer: person(r.reviewer_email, r.reviewer_name),
  reviewNote: r.review_note,
  rejectReason: r.reject_reason,
  activatedBy: person(r.activator_email, r.activator_name),
  createdAt: r.created_at.toISOString(),
  submittedAt: iso(r.submitted_at),
  reviewedAt: iso(r.reviewed_at),
  activatedAt: iso(r.activated_at),
  retiredAt: iso(r.retired_at),
});

/** The API shape: service-only fields left out. */
export const toPublicVersion = ({
  loopTag: _tag,
  samplePeriodS: _t,
  authorId: _a,
  approvedAgainstVersionId: _v,
  ...version
}: VersionRecord): ModelVersion => version;

export async function findVersion(db: Db, id: string): Promise<VersionRecord | undefined> {
  const row = (await selectVersions(db).where('v.id', id).first()) as Raw | undefined;
  return row && toVersion(row);
}

export async function listLoopVersions(db: Db, loopId: string): Promise<VersionRecord[]> {
  return ((await selectVersions(db).where('v.loop_id', loopId).orderBy('v.number', 'desc')) as Raw[]).map(toVersion);
}

export async function findActiveVersionId(db: Db, loopId: string): Promise<string | null> {
  const row = await db('model_versions')
    .where({ loop_id: loopId, status: 'active' })
    .first<{ id: string } | undefined>('id');
  return row?.id ?? null;
}

/** Inserts the next number of the loop; call with the loop row locked so numbers never collide. */
export async function insertVersion(
  trx: Db,
  draft: PreparedModel & {
    loopId: string;
    samplePeriodS: number;
    changeNote: string;
    analysis: ModelAnalysis;
    authorId: string;
  },
) {
  const [{ next }] = await trx('model_versions')
    .where({ loop_id: draft.loopId })
    .select(trx.raw('coalesce(max(number), 0) + 1 as next'));
  const json = (value: unknown) => (value === null ? null : JSON.stringify(value));
  const [row] = await trx('model_versions')
    .insert({
      loop_id: draft.loopId,
      number: next,
      status: 'draft',
      sample_period_s: draft.samplePeriodS,
      a: json(draft.A),
      b: json(draft.B),
      c: json(draft.C),
      d: json(draft.D),
      continuous: json(draft.continuous),
      correction: json(draft.correction),
      change_note: draft.changeNote,
      analysis: json(draft.analysis),
      author_id: draft.authorId,
    })
    .returning<{ id: string }[]>('id');
  return row.id;
}

/** Changes status and review fields; the matrices are never touched (a trigger enforces it too). */
export async function updateVersion(trx: Db, id: string, fields: Record<string, unknown>): Promise<void> {
  await trx('model_versions').where({ id }).update(fields);
}
