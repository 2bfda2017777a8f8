import type { Resolver } from 'react-hook-form';
import { parseCellNumber } from '../../../lib/parse-number';
import { nestErrors } from './field-errors';
import { SIGNAL_GROUPS, type LoopFormValues, type SignalGroup } from './loop-form-values';

/** The api's tag rule (contracts/registry.ts TAG_PATTERN), repeated here because the contract module brings zod along. */
const TAG_PATTERN = /^[A-Z][A-Z0-9]*(?:[-_.][A-Z0-9]+)*$/;

const LIMITS: Record<SignalGroup, { max: number; word: string }> = {
  inputs: { max: 50, word: 'input' },
  states: { max: 200, word: 'state' },
  outputs: { max: 50, word: 'output' },
};

function isKnownTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

function checkSignals(values: LoopFormValues, group: SignalGroup, report: (path: string, message: string) => void) {
  const rows = values[group];
  const { max, word } = LIMITS[group];
  if (rows.length === 0) report(`${group}.root`, `add at least one ${word}`);
  if (rows.length > max) report(`${group}.root`, `at most ${max} ${word}s`);
  const seen = new Set<string>();
  const withValues = rows.some((row) => row.operatingValue.trim() !== '');
  rows.forEach((row, i) => {
    const name = row.name.trim();
    if (name === '') report(`${group}.${i}.name`, `name ${word} ${i + 1}`);
    else if (name.length > 40) report(`${group}.${i}.name`, 'at most 40 characters');
    else if (seen.has(name.toLowerCase())) report(`${group}.${i}.name`, `another ${word} already has this name`);
    seen.add(name.toLowerCase());
    if (row.unit.trim().length > 20) report(`${group}.${i}.unit`, 'at most 20 characters');
    const value = parseCellNumber(row.operatingValue);
    if (withValues && value === null)
      report(`${group}.${i}.operatingValue`, `give every ${word} a value, or leave them all empty for zero`);
    if (value === undefined) report(`${group}.${i}.operatingValue`, 'not a number');
  });
}

/** The same rules as the api's schema, checked as the engineer types. */
export function validateLoopForm(values: LoopFormValues): { path: string; message: string }[] {
  const problems: { path: string; message: string }[] = [];
  const report = (path: string, message: string) => problems.push({ path, message });
  const tag = values.tag.trim();
  if (tag === '') report('tag', 'give the loop its plant tag');
  else if (tag.length > 40 || !TAG_PATTERN.test(tag))
    report('tag', 'use capitals, digits and single - _ . separators, e.g. AER-DO-101');
  if (values.name.trim() === '') report('name', 'give the loop a name people recognise');
  else if (values.name.trim().length > 120) report('name', 'at most 120 characters');
  if (values.area === '') report('area', 'pick the area the loop belongs to');
  if (values.description.length > 2000) report('description', 'at most 2000 characters');
  const period = parseCellNumber(values.samplePeriodS);
  if (period === null) report('samplePeriodS', 'give the sample period in seconds');
  else if (period === undefined || period <= 0 || period > 86_400)
    report('samplePeriodS', 'a number of seconds above 0 and at most 86 400 (one day)');
  if (!isKnownTimeZone(values.timeZone.trim())) report('timeZone', 'use a time zone name such as Europe/London');
  for (const group of SIGNAL_GROUPS) checkSignals(values, group, report);
  return problems;
}

export const loopFormResolver: Resolver<LoopFormValues> = (values) => {
  const problems = validateLoopForm(values);
  return problems.length === 0 ? { values, errors: {} } : { values: {}, errors: nestErrors<LoopFormValues>(problems) };
};
