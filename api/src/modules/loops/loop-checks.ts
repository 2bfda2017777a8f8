import type { Db } from '../../db/knex.js';
import { badRequest } from '../../http/errors.js';
import { areaExists } from '../areas/areas.repository.js';
import type { LoopRecord } from './loops.repository.js';

type FieldProblem = { path: string; message: string };

const OPERATING_POINT_PARTS = [
  { key: 'x0', signals: 'states', what: 'state' },
  { key: 'u0', signals: 'inputs', what: 'input' },
  { key: 'y0', signals: 'outputs', what: 'output' },
] as const;

function isKnownTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

/**
 * Checks what a schema cannot: the area exists, the operating point has one entry per signal,
 * the time zone is known. Throws one 400 that lists every problem, in the route table's shape.
 */
export async function assertLoopConsistent(db: Db, loop: LoopRecord): Promise<void> {
  const problems: FieldProblem[] = [];
  if (!(await areaExists(db, loop.area)))
    problems.push({ path: 'body.area', message: `There is no area "${loop.area}".` });
  for (const part of OPERATING_POINT_PARTS) {
    const values = loop.operatingPoint[part.key];
    const expected = loop[part.signals].length;
    if (values && values.length !== expected) {
      problems.push({
        path: `body.operatingPoint.${part.key}`,
        message: `${part.key} has ${values.length} entries; the loop has ${expected} ${part.signals} (one value per ${part.what}).`,
      });
    }
  }
  if (!isKnownTimeZone(loop.timeZone)) {
    problems.push({
      path: 'body.timeZone',
      message: `"${loop.timeZone}" is not a known time zone; use a name such as Europe/London.`,
    });
  }
  if (problems.length) {
    throw badRequest(`The loop is not valid: ${problems.map((p) => `${p.path}: ${p.message}`).join('; ')}`, problems);
  }
}

/** Signal counts and sample period that stored model versions were built for. */
export function lockedFieldChanges(before: LoopRecord, after: LoopRecord): string[] {
  const changes: string[] = [];
  for (const signals of ['inputs', 'states', 'outputs'] as const) {
    if (before[signals].length !== after[signals].length) {
      changes.push(`the number of ${signals} (${before[signals].length} → ${after[signals].length})`);
    }
  }
  if (before.samplePeriodS !== after.samplePeriodS)
    changes.push(`the sample period (${before.samplePeriodS} s → ${after.samplePeriodS} s)`);
  return changes;
}
