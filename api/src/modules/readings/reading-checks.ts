import type { Slot } from './sample-grid.js';
import { slotOf } from './sample-grid.js';

/** What a reading is checked against: the loop's signal counts and the accepted time window. */
export interface ReadingRules {
  inputs: number;
  outputs: number;
  samplePeriodS: number;
  /** Latest accepted time (now + tolerance), epoch ms. */
  latestMs: number;
  /** Earliest accepted time, epoch ms (-Infinity: no limit). */
  earliestMs: number;
  /** Says what to do about a reading older than earliestMs. */
  tooOldAdvice: string;
}

export interface CheckedReading extends Slot {
  tMs: number;
  u: number[];
  y: number[];
}

export type ReadingCheck = { ok: true; reading: CheckedReading } | { ok: false; reason: string };

const ISO_WITH_ZONE = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d{1,9})?(Z|[+-]\d{2}:\d{2})$/;
const values = (n: number) => `${n} value${n === 1 ? '' : 's'}`;
const reject = (reason: string): ReadingCheck => ({ ok: false, reason });

/** Epoch ms of an ISO 8601 time with a zone, or a reason why it is not one. */
export function parseTime(t: unknown): number | string {
  if (t === undefined || t === null) return 't is missing';
  if (typeof t !== 'string' || !ISO_WITH_ZONE.test(t))
    return 't is not an ISO 8601 time with a time zone, e.g. 2026-12-02T08:00:00Z';
  const ms = Date.parse(t);
  return Number.isNaN(ms) ? `t (${t}) is not a calendar time` : ms;
}

/** A reason when the vector is not `expected` finite numbers; `label(i)` names element i. */
export function vectorProblem(
  name: string,
  vector: unknown,
  expected: number,
  label = (i: number) => `${name}[${i}]`,
): string | undefined {
  if (!Array.isArray(vector))
    return `${name} is ${vector === undefined ? 'missing' : 'not an array'}; expected ${values(expected)}`;
  if (vector.length !== expected) return `${name} has ${values(vector.length)}, expected ${expected}`;
  for (let i = 0; i < vector.length; i++) {
    const v: unknown = vector[i];
    if (typeof v !== 'number' || !Number.isFinite(v)) return `${label(i)} is not a finite number`;
  }
  return undefined;
}

/** Time window and slot of a reading whose time parsed. */
export function placeInTime(tMs: number, rules: ReadingRules): Slot | string {
  if (tMs > rules.latestMs) {
    const ahead = Math.round((tMs - rules.latestMs) / 1000);
    return `t is in the future: ${ahead} s beyond the accepted clock tolerance; check the sender's clock`;
  }
  if (tMs < rules.earliestMs) return `t is too old: ${rules.tooOldAdvice}`;
  return slotOf(tMs, rules.samplePeriodS);
}

/** Checks one reading of a POST …/readings batch: an object {t, u, y}. */
export function checkReading(item: unknown, rules: ReadingRules): ReadingCheck {
  if (typeof item !== 'object' || item === null || Array.isArray(item))
    return reject('the reading is not an object {"t","u","y"}');
  const { t, u, y } = item as Record<string, unknown>;
  const tMs = parseTime(t);
  if (typeof tMs === 'string') return reject(tMs);
  const problem = vectorProblem('u', u, rules.inputs) ?? vectorProblem('y', y, rules.outputs);
  if (problem) return reject(problem);
  const slot = placeInTime(tMs, rules);
  if (typeof slot === 'string') return reject(slot);
  return { ok: true, reading: { tMs, ...slot, u: u as number[], y: y as number[] } };
}
