import {
  DRIFT_RULE_KINDS,
  DriftRuleKindSchema,
  PARAMS_SCHEMAS,
  type DriftRuleKind,
  type DriftRuleParams,
} from '../../contracts/alerts.js';
import { AppError, badRequest } from '../../http/errors.js';

export interface ParamsProblem {
  path: string;
  message: string;
}

/** The kind named in a path, or 404 naming the kinds there are. */
export function requireKind(kind: string): DriftRuleKind {
  const parsed = DriftRuleKindSchema.safeParse(kind);
  if (parsed.success) return parsed.data;
  throw new AppError(
    404,
    'not_found',
    `There is no drift rule kind "${kind}"; the kinds are ${DRIFT_RULE_KINDS.join(', ')}.`,
  );
}

const plural = (n: number, one: string) => `${n} ${one}${n === 1 ? '' : 's'}`;

/** Per-output arrays must have one entry per output of the loop. */
function lengthProblems(params: Record<string, unknown>, outputs: number): ParamsProblem[] {
  const problems: ParamsProblem[] = [];
  for (const field of ['limits', 'sigma']) {
    const value = params[field];
    if (Array.isArray(value) && value.length !== outputs) {
      problems.push({
        path: `params.${field}`,
        message: `params.${field} has ${plural(value.length, 'value')}, the loop has ${plural(outputs, 'output')}`,
      });
    }
  }
  return problems;
}

/** Problems a rule of this kind would have on a loop with this many outputs; none when it can run. */
export function ruleParamsProblems(
  kind: DriftRuleKind,
  raw: Record<string, unknown>,
  outputs: number,
): { params: DriftRuleParams | null; problems: ParamsProblem[] } {
  const parsed = PARAMS_SCHEMAS[kind].safeParse(raw);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((issue) => {
      const path = ['params', ...issue.path.map(String)].join('.');
      return { path, message: `${path}: ${issue.message}` };
    });
    return { params: null, problems };
  }
  const params = parsed.data as Record<string, unknown>;
  const problems = lengthProblems(params, outputs);
  if (kind === 'band' && params.mode === 'absolute' && Array.isArray(params.limits)) {
    if (params.limits.every((limit) => limit === null))
      problems.push({ path: 'params.limits', message: 'params.limits watches no output: give at least one limit' });
  }
  return { params: problems.length ? null : (parsed.data as DriftRuleParams), problems };
}

/** The params validated for this kind and loop, or 400 naming every field that is wrong. */
export function parseRuleParams(kind: DriftRuleKind, raw: Record<string, unknown>, outputs: number): DriftRuleParams {
  const { params, problems } = ruleParamsProblems(kind, raw, outputs);
  if (params) return params;
  throw badRequest(
    `The ${kind} rule's settings are not valid: ${problems.map((p) => p.message).join('; ')}.`,
    problems.map((p) => ({ path: `body.${p.path}`, message: p.message })),
  );
}

/** Stored params as the evaluator needs them (defaults applied); null when they no longer parse. */
export function storedParams(kind: DriftRuleKind, raw: unknown, outputs: number): DriftRuleParams | null {
  if (!raw || typeof raw !== 'object') return null;
  return ruleParamsProblems(kind, raw as Record<string, unknown>, outputs).params;
}
