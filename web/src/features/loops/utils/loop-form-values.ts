import type { CreateLoopBody } from '../api/create-loop';
import type { Loop } from '../api/get-loops';
import { parseCellNumber } from '../../../lib/parse-number';

export type SignalRow = { name: string; unit: string; operatingValue: string };

export type SignalGroup = 'inputs' | 'states' | 'outputs';

export type LoopFormValues = {
  tag: string;
  name: string;
  area: string;
  description: string;
  samplePeriodS: string;
  timeZone: string;
  inputs: SignalRow[];
  states: SignalRow[];
  outputs: SignalRow[];
};

/** Where each group's operating-point values go in the api body. */
export const OPERATING_POINT_KEYS = { inputs: 'u0', states: 'x0', outputs: 'y0' } as const satisfies Record<
  SignalGroup,
  string
>;

export const SIGNAL_GROUPS: readonly SignalGroup[] = ['inputs', 'states', 'outputs'];

export const EMPTY_SIGNAL: SignalRow = { name: '', unit: '', operatingValue: '' };

export function browserTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
}

export function newLoopValues(): LoopFormValues {
  return {
    tag: '',
    name: '',
    area: '',
    description: '',
    samplePeriodS: '',
    timeZone: browserTimeZone(),
    inputs: [{ ...EMPTY_SIGNAL }],
    states: [{ ...EMPTY_SIGNAL }],
    outputs: [{ ...EMPTY_SIGNAL }],
  };
}

export function loopValues(loop: Loop): LoopFormValues {
  const rows = (group: SignalGroup) =>
    loop[group].map((signal, i) => {
      const value = loop.operatingPoint[OPERATING_POINT_KEYS[group]]?.[i];
      return { name: signal.name, unit: signal.unit, operatingValue: value === undefined ? '' : String(value) };
    });
  return {
    tag: loop.tag,
    name: loop.name,
    area: loop.area,
    description: loop.description,
    samplePeriodS: String(loop.samplePeriodS),
    timeZone: loop.timeZone,
    inputs: rows('inputs'),
    states: rows('states'),
    outputs: rows('outputs'),
  };
}

/** A group's operating point, or undefined when every value is left empty (zero deviation). */
export function operatingValues(rows: SignalRow[]): number[] | undefined {
  if (rows.every((row) => row.operatingValue.trim() === '')) return undefined;
  return rows.map((row) => parseCellNumber(row.operatingValue) ?? Number.NaN);
}

/** The api body from values that passed validation. */
export function loopBody(values: LoopFormValues): CreateLoopBody {
  const signals = (group: SignalGroup) =>
    values[group].map((row) => ({ name: row.name.trim(), unit: row.unit.trim() }));
  const operatingPoint = Object.fromEntries(
    SIGNAL_GROUPS.flatMap((group) => {
      const numbers = operatingValues(values[group]);
      return numbers ? [[OPERATING_POINT_KEYS[group], numbers]] : [];
    }),
  );
  return {
    tag: values.tag.trim(),
    name: values.name.trim(),
    area: values.area,
    description: values.description.trim(),
    samplePeriodS: parseCellNumber(values.samplePeriodS) ?? Number.NaN,
    timeZone: values.timeZone.trim(),
    inputs: signals('inputs'),
    states: signals('states'),
    outputs: signals('outputs'),
    operatingPoint,
  };
}
