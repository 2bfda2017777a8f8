import type { DriftRuleKind, Priority } from '@shadowloop/api/contracts';
import { parseCellNumber } from '../../../lib/parse-number';

/** Every field of the rule editor as typed; each kind reads the ones it needs. */
export type RuleForm = {
  enabled: boolean;
  priority: Priority;
  note: string;
  mode: 'absolute' | 'sigma';
  limits: string[];
  k: string;
  h: string;
  sigma: string[];
  shift: string;
  raiseAfter: string;
  clearAfter: string;
  deadbandPercent: string;
  falseAlarmProbability: string;
  afterSamples: string;
};

/** Problems by parameter path: `k`, `sigma.1`, `limits`, `deadband`. */
export type RuleProblems = Record<string, string>;

const text = (value: unknown) => (typeof value === 'number' && Number.isFinite(value) ? String(value) : '');
const texts = (value: unknown, outputs: number) =>
  Array.from({ length: outputs }, (_, i) => (Array.isArray(value) ? text(value[i]) : ''));

/** Suggested starting points for a kind the loop does not have yet; sigma is left for the engineer. */
const DEFAULTS: Record<DriftRuleKind, Record<string, unknown>> = {
  band: { mode: 'sigma', k: 4, raiseAfter: 3, clearAfter: 5, deadband: 0.1 },
  cusum: { k: 0.5, h: 5, shift: 1 },
  nis: { falseAlarmProbability: 0.001, raiseAfter: 3, clearAfter: 5 },
  stale: { afterSamples: 10 },
};

export function ruleForm(
  kind: DriftRuleKind,
  rule: { enabled: boolean; priority: Priority; params: Record<string, unknown> } | undefined,
  outputs: number,
): RuleForm {
  const p = rule?.params ?? DEFAULTS[kind];
  return {
    enabled: rule?.enabled ?? true,
    priority: rule?.priority ?? 2,
    note: '',
    mode: p.mode === 'absolute' ? 'absolute' : 'sigma',
    limits: texts(p.limits, outputs),
    k: text(p.k),
    h: text(p.h),
    sigma: texts(p.sigma, outputs),
    shift: text(p.shift),
    raiseAfter: text(p.raiseAfter),
    clearAfter: text(p.clearAfter),
    deadbandPercent: typeof p.deadband === 'number' ? String(Number((p.deadband * 100).toPrecision(6))) : '',
    falseAlarmProbability: text(p.falseAlarmProbability),
    afterSamples: text(p.afterSamples),
  };
}

type Reader = { problems: RuleProblems; number(field: string, value: string, optional?: boolean): number | undefined };

function reader(): Reader {
  const problems: RuleProblems = {};
  return {
    problems,
    number(field, value, optional = false) {
      const parsed = parseCellNumber(value);
      if (parsed === null && optional) return undefined;
      if (parsed === null) problems[field] = 'Enter a number.';
      else if (parsed === undefined) problems[field] = `“${value.trim()}” is not a number.`;
      else return parsed;
      return undefined;
    },
  };
}

/** Per-output numbers; all blank gives undefined when the list is optional. */
function list(r: Reader, field: string, values: string[], blank: 'required' | 'null' | 'optional') {
  if (blank === 'optional' && values.every((v) => v.trim() === '')) return undefined;
  return values.map((value, i) =>
    blank === 'null' && value.trim() === '' ? null : (r.number(`${field}.${i}`, value) ?? NaN),
  );
}

/**
 * The params the api takes for this kind, read from the form; the server checks ranges and says
 * what is wrong at the field (its problems use the same paths).
 */
export function ruleParams(
  kind: DriftRuleKind,
  form: RuleForm,
): { params: Record<string, unknown>; problems: RuleProblems } {
  const r = reader();
  let params: Record<string, unknown>;
  if (kind === 'stale') params = { afterSamples: r.number('afterSamples', form.afterSamples) };
  else if (kind === 'cusum') {
    params = {
      k: r.number('k', form.k),
      h: r.number('h', form.h),
      sigma: list(r, 'sigma', form.sigma, 'required'),
      shift: r.number('shift', form.shift),
    };
  } else if (kind === 'nis') {
    params = {
      falseAlarmProbability: r.number('falseAlarmProbability', form.falseAlarmProbability),
      raiseAfter: r.number('raiseAfter', form.raiseAfter),
      clearAfter: r.number('clearAfter', form.clearAfter),
      sigma: list(r, 'sigma', form.sigma, 'optional'),
    };
  } else {
    const deadband = r.number('deadband', form.deadbandPercent);
    params = {
      mode: form.mode,
      ...(form.mode === 'absolute' ? { limits: list(r, 'limits', form.limits, 'null') } : { k: r.number('k', form.k) }),
      sigma: list(r, 'sigma', form.sigma, form.mode === 'sigma' ? 'required' : 'optional'),
      raiseAfter: r.number('raiseAfter', form.raiseAfter),
      clearAfter: r.number('clearAfter', form.clearAfter),
      deadband: deadband === undefined ? undefined : deadband / 100,
    };
  }
  return { params: JSON.parse(JSON.stringify(params)) as Record<string, unknown>, problems: r.problems };
}
