import type { Knex } from 'knex';
import { modelAtOperatingPoint, validateModel, type Matrix } from '../engine/index.js';
import type { ActiveModel } from './hot-swap.js';

type Raw = {
  version_id: string;
  number: number;
  a: Matrix;
  b: Matrix;
  c: Matrix | null;
  d: Matrix | null;
  correction: { mode: ActiveModel['correction']['mode']; K: Matrix | null };
  loop_id: string;
  tag: string;
  sample_period_s: number;
  operating_point: { x0?: number[]; u0?: number[]; y0?: number[] };
};

function selectActive(db: Knex) {
  return db('model_versions as v')
    .join('loops as l', 'l.id', 'v.loop_id')
    .where('v.status', 'active')
    .select(
      'v.id as version_id',
      'v.number',
      'v.a',
      'v.b',
      'v.c',
      'v.d',
      'v.correction',
      'l.id as loop_id',
      'l.tag',
      'l.sample_period_s',
      'l.operating_point',
    );
}

function toActiveModel(r: Raw): ActiveModel {
  return {
    loopId: r.loop_id,
    loopTag: r.tag,
    samplePeriodS: r.sample_period_s,
    version: { id: r.version_id, number: r.number },
    model: modelAtOperatingPoint(r, r.operating_point),
    correction: { mode: r.correction.mode, K: r.correction.K ?? null },
  };
}

/** Rows the engine would refuse are left out and reported, so one bad row never stops the others. */
function usable(rows: Raw[], report: (line: string) => void): ActiveModel[] {
  return rows.map(toActiveModel).filter((active) => {
    const problems = validateModel(active.model);
    if (problems.length)
      report(
        `${active.loopTag} version ${active.version.number} is not usable: ${problems.map((p) => p.message).join('; ')}`,
      );
    return problems.length === 0;
  });
}

/** Every loop's active version with its operating point. */
export async function loadActiveModels(db: Knex, report: (line: string) => void): Promise<ActiveModel[]> {
  return usable((await selectActive(db)) as Raw[], report);
}

/** One loop's active version, or undefined when it has none. */
export async function loadActiveModel(
  db: Knex,
  loopId: string,
  report: (line: string) => void,
): Promise<ActiveModel | undefined> {
  return usable((await selectActive(db).where('l.id', loopId)) as Raw[], report)[0];
}
