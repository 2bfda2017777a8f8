import { describeError } from '../../../components/errors/describe-error';
import { isApiError } from '../../../lib/api';

export type ServerErrors = { fields: Record<string, string>; general: string | null };

type Detail = { path?: string | (string | number)[]; message?: string };

const pathParts = (path: Detail['path']) =>
  (Array.isArray(path) ? path.map(String) : (path ?? '').split('.')).filter((part) => part !== '' && part !== 'body');

/**
 * A refusal split into problems a form can show at its fields (`fieldOf` maps an api path such as
 * ['params', 'k'] to a field name, or null) and the rest, in plain words.
 */
export function serverErrors(error: unknown, fieldOf: (path: string[]) => string | null): ServerErrors {
  if (!error) return { fields: {}, general: null };
  if (!isApiError(error) || error.status !== 400 || !Array.isArray(error.details)) {
    return { fields: {}, general: describeError(error).explanation };
  }
  const fields: Record<string, string> = {};
  const rest: string[] = [];
  for (const detail of error.details as Detail[]) {
    const field = fieldOf(pathParts(detail.path));
    if (field && detail.message) fields[field] ??= detail.message;
    else if (detail.message) rest.push(detail.message);
  }
  const general = rest.length ? rest.join('; ') : Object.keys(fields).length ? null : error.message;
  return { fields, general };
}

/** For forms whose fields are named like the body's top-level keys. */
export const topLevelField =
  (known: readonly string[]) =>
  (path: string[]): string | null =>
    known.includes(path[0]) ? path[0] : null;
