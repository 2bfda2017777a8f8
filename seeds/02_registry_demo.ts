import type { Knex } from 'knex';
import { analyzeModel, discretizeZoh, steadyStateKalman, type Matrix } from '@shadowloop/simulator/engine';
import { loopColumns } from '../api/src/modules/loops/loops.repository.js';
import { DEMO_AREAS, DEMO_LOOPS, type DemoLoop, type DemoVersion } from './registry-demo/quillmere-loops.js';

const AUTHOR = 'engineer@quillmere.example';
const REVIEWER = 'reviewer@quillmere.example';
const DAY_MS = 86_400_000;
const identity = (n: number): Matrix =>
  Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
const json = (value: unknown) => (value === undefined || value === null ? null : JSON.stringify(value));

/** A model version row: ZOH of the continuous model, its analysis and correction, and its review history. */
function versionRow(
  loop: DemoLoop,
  version: DemoVersion,
  number: number,
  people: { author: string; reviewer: string },
) {
  const { A, B } = discretizeZoh(version.Ac, version.Bc, loop.samplePeriodS);
  const C = version.C ?? identity(A.length);
  const { mode, Q, R } = version.correction;
  const gain = mode === 'kalman' && Q && R ? steadyStateKalman(A, C, Q, R) : { K: null, P: null };
  const at = (offsetHours: number) => new Date(Date.now() - version.daysAgo * DAY_MS + offsetHours * 3_600_000);
  const reviewed = version.status === 'active';
  return {
    number,
    status: version.status,
    sample_period_s: loop.samplePeriodS,
    a: json(A),
    b: json(B),
    c: json(version.C),
    d: null,
    continuous: json({ Ac: version.Ac, Bc: version.Bc, samplePeriodS: loop.samplePeriodS }),
    correction: json({ mode, Q: Q ?? null, R: R ?? null, ...gain }),
    change_note: version.changeNote,
    analysis: json(analyzeModel({ A, B, C: version.C, samplePeriodS: loop.samplePeriodS })),
    author_id: people.author,
    created_at: at(0),
    submitted_at: at(2),
    ...(reviewed
      ? {
          reviewer_id: people.reviewer,
          reviewed_at: at(20),
          review_note: 'Checked against the step-test records.',
          activated_by: people.reviewer,
          activated_at: at(22),
        }
      : {}),
  };
}

async function userId(trx: Knex.Transaction, email: string): Promise<string> {
  const row = await trx('users').where({ email }).first<{ id: string } | undefined>('id');
  if (!row) throw new Error(`the registry demo needs the demo user ${email} (seeds/01_demo_users.ts)`);
  return row.id;
}

/**
 * The Quillmere demo loops with one active version each (authored by the engineer, approved and
 * activated by the reviewer) and one version awaiting review. Idempotent: a loop whose tag exists is
 * left as it is, so a second run changes nothing.
 */
export async function seed(knex: Knex): Promise<void> {
  await knex.transaction(async (trx) => {
    await trx('areas').insert(DEMO_AREAS).onConflict('id').ignore();
    const people = { author: await userId(trx, AUTHOR), reviewer: await userId(trx, REVIEWER) };
    for (const loop of DEMO_LOOPS) {
      if (await trx('loops').where({ tag: loop.tag }).first('id')) continue;
      const [{ id }] = await trx('loops')
        .insert({
          ...loopColumns({ ...loop, timeZone: 'Europe/London' }),
          residual_band: json(loop.residualBand),
          created_by: people.author,
        })
        .returning<{ id: string }[]>('id');
      const rows = loop.versions.map((version, i) => ({ ...versionRow(loop, version, i + 1, people), loop_id: id }));
      await trx('model_versions').insert(rows);
    }
  });
}
