import type { ImportMapping, ImportPreview } from '@shadowloop/api/contracts';

type Signal = { name: string; unit: string };
type LoopSignals = { inputs: Signal[]; outputs: Signal[] };

/** The mapping form: a column position per field, as text ('' while not chosen). */
export type MappingValues = { t: string; u: string[]; y: string[] };

export type MappingProblems = Partial<Record<string, string>>;

function positionOf(ref: string | number | undefined, header: readonly string[]): string {
  if (ref === undefined) return '';
  const index = typeof ref === 'number' ? ref : header.indexOf(ref);
  return index >= 0 && index < header.length ? String(index) : '';
}

/** The server's suggestion (by name or position) as form values, or blanks to choose. */
export function initialMapping(preview: ImportPreview, loop: LoopSignals): MappingValues {
  const s = preview.suggestedMapping;
  return {
    t: positionOf(s?.t, preview.header),
    u: loop.inputs.map((_, i) => positionOf(s?.u[i], preview.header)),
    y: loop.outputs.map((_, i) => positionOf(s?.y[i], preview.header)),
  };
}

/**
 * Every field needs a column, and no column may feed two fields. Problems are keyed by field:
 * `t`, `u.0`, `y.1`, … and say what to change.
 */
export function validateMapping(values: MappingValues, header: readonly string[], loop: LoopSignals): MappingProblems {
  const problems: MappingProblems = {};
  const fields = [
    { key: 't', label: 'the time', value: values.t },
    ...loop.inputs.map((s, i) => ({ key: `u.${i}`, label: s.name, value: values.u[i] ?? '' })),
    ...loop.outputs.map((s, i) => ({ key: `y.${i}`, label: s.name, value: values.y[i] ?? '' })),
  ];
  const firstUse = new Map<string, string>();
  for (const field of fields) {
    if (field.value === '') {
      problems[field.key] = `Choose the column that holds ${field.label}.`;
      continue;
    }
    const earlier = firstUse.get(field.value);
    if (earlier)
      problems[field.key] = `Column “${header[Number(field.value)]}” is already used for ${earlier}; choose another.`;
    else firstUse.set(field.value, field.label);
  }
  return problems;
}

/** The mapping the import route takes: zero-based column positions. */
export function toImportMapping(values: MappingValues): ImportMapping {
  return { t: Number(values.t), u: values.u.map(Number), y: values.y.map(Number) };
}
