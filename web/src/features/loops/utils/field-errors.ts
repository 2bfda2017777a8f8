import type { FieldError, FieldErrors, FieldValues } from 'react-hook-form';

/** Builds react-hook-form's nested error object from dotted paths (`inputs.0.name`, `states.root`). */
export function nestErrors<T extends FieldValues>(problems: { path: string; message: string }[]): FieldErrors<T> {
  const errors: Record<string, unknown> = {};
  for (const { path, message } of problems) {
    const keys = path.split('.');
    let node: Record<string, unknown> = errors;
    keys.forEach((key, index) => {
      if (index === keys.length - 1) {
        node[key] ??= { type: 'validate', message } satisfies FieldError;
        return;
      }
      node[key] ??= /^\d+$/.test(keys[index + 1]) ? [] : {};
      node = node[key] as Record<string, unknown>;
    });
  }
  return errors as FieldErrors<T>;
}
