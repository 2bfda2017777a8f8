import { serverErrors, type ServerErrors } from '../../alerts/utils/server-errors';

const TOP_LEVEL = new Set(['enabled', 'priority', 'note']);

/** api paths `params.sigma.1` → `sigma.1`; the top-level fields keep their names. */
function ruleFieldOf(path: string[]): string | null {
  if (path[0] === 'params' && path.length > 1) return path.slice(1).join('.');
  if (path[0] === 'params') return 'params';
  return TOP_LEVEL.has(path[0]) ? path[0] : null;
}

/** The server's messages name the path first (`params.k: must be …`); at the field that is said already. */
const withoutPath = (message: string) => message.replace(/^params\.[\w.]+: /, '');

export function ruleServerErrors(error: unknown): ServerErrors {
  const split = serverErrors(error, ruleFieldOf);
  const fields = Object.fromEntries(
    Object.entries(split.fields).map(([field, message]) => [field, withoutPath(message)]),
  );
  return { fields, general: split.general };
}
