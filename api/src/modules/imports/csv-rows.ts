import type { ImportMapping } from '../../contracts/ingest.js';
import { badRequest } from '../../http/errors.js';
import {
  parseTime,
  placeInTime,
  vectorProblem,
  type ReadingCheck,
  type ReadingRules,
} from '../readings/reading-checks.js';

/** Zero-based column positions of t, u[0…m-1] and y[0…p-1]. */
export interface ColumnPlan {
  t: number;
  u: number[];
  y: number[];
  header: string[];
}

function columnIndex(header: string[], ref: string | number, role: string, problems: string[]): number {
  if (typeof ref === 'number') {
    if (ref < header.length) return ref;
    problems.push(
      `${role}: column ${ref} does not exist (the file has ${header.length} columns, 0 … ${header.length - 1})`,
    );
    return -1;
  }
  const exact = header.indexOf(ref);
  const loose = exact >= 0 ? exact : header.findIndex((h) => h.trim().toLowerCase() === ref.trim().toLowerCase());
  if (loose < 0) problems.push(`${role}: there is no column "${ref}" (columns: ${header.join(', ')})`);
  return loose;
}

/** Resolves the mapping against the header; 400 naming every problem. */
export function planColumns(
  header: string[],
  mapping: ImportMapping,
  counts: { inputs: number; outputs: number },
): ColumnPlan {
  const problems: string[] = [];
  if (mapping.u.length !== counts.inputs)
    problems.push(`u maps ${mapping.u.length} columns; the loop has ${counts.inputs} inputs`);
  if (mapping.y.length !== counts.outputs)
    problems.push(`y maps ${mapping.y.length} columns; the loop has ${counts.outputs} outputs`);
  const plan = {
    header,
    t: columnIndex(header, mapping.t, 't', problems),
    u: mapping.u.map((ref, i) => columnIndex(header, ref, `u[${i}]`, problems)),
    y: mapping.y.map((ref, i) => columnIndex(header, ref, `y[${i}]`, problems)),
  };
  if (problems.length) throw badRequest(`The column mapping does not fit the file: ${problems.join('; ')}.`, problems);
  return plan;
}

const toNumber = (cell: string | undefined) => (cell === undefined || cell.trim() === '' ? Number.NaN : Number(cell));

/** One CSV data row checked like a posted reading; reasons name the column. */
export function checkRow(row: string[], plan: ColumnPlan, rules: ReadingRules): ReadingCheck {
  const tMs = parseTime(row[plan.t]);
  if (typeof tMs === 'string') return { ok: false, reason: `${tMs} (column "${plan.header[plan.t]}")` };
  const u = plan.u.map((c) => toNumber(row[c]));
  const y = plan.y.map((c) => toNumber(row[c]));
  const problem =
    vectorProblem('u', u, rules.inputs, (i) => `u[${i}] (column "${plan.header[plan.u[i]]}")`) ??
    vectorProblem('y', y, rules.outputs, (i) => `y[${i}] (column "${plan.header[plan.y[i]]}")`);
  if (problem) return { ok: false, reason: problem };
  const slot = placeInTime(tMs, rules);
  if (typeof slot === 'string') return { ok: false, reason: slot };
  return { ok: true, reading: { tMs, ...slot, u, y } };
}
