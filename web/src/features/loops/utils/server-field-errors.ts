import { isApiError } from '../../../lib/api';
import { OPERATING_POINT_KEYS, SIGNAL_GROUPS } from './loop-form-values';

export type ServerProblem = { path: string; message: string };

const FORM_FIELDS = new Set(['tag', 'name', 'area', 'description', 'samplePeriodS', 'timeZone', ...SIGNAL_GROUPS]);

/** An api path (`body.inputs.0.name`, `body.operatingPoint.x0`) as a form field, or null when no field fits. */
export function formFieldOf(apiPath: string | (string | number)[]): string | null {
  const parts = (Array.isArray(apiPath) ? apiPath.map(String) : apiPath.split('.')).filter((part) => part !== 'body');
  if (parts[0] === 'operatingPoint') {
    const group = SIGNAL_GROUPS.find((g) => OPERATING_POINT_KEYS[g] === parts[1]);
    return group ? `${group}.root` : null;
  }
  if (!FORM_FIELDS.has(parts[0])) return null;
  if (SIGNAL_GROUPS.includes(parts[0] as never) && parts.length === 1) return `${parts[0]}.root`;
  return parts.join('.');
}

/**
 * Splits an api refusal into problems that belong to a field and the rest. A 409 on registering is
 * a tag that another loop already uses.
 */
export function serverProblems(error: unknown, conflictField?: string): { fields: ServerProblem[]; general: string[] } {
  if (!isApiError(error)) return { fields: [], general: [] };
  if (error.status === 409 && conflictField)
    return { fields: [{ path: conflictField, message: error.message }], general: [] };
  if (error.status !== 400 || !Array.isArray(error.details)) return { fields: [], general: [error.message] };
  const fields: ServerProblem[] = [];
  const general: string[] = [];
  for (const detail of error.details as { path?: string | (string | number)[]; message?: string }[]) {
    const field = detail.path === undefined ? null : formFieldOf(detail.path);
    if (field && detail.message) fields.push({ path: field, message: detail.message });
    else if (detail.message) general.push(detail.message);
  }
  return { fields, general: general.length || fields.length ? general : [error.message] };
}
