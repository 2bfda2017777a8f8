import { useId, type ReactNode } from 'react';

export const INPUT_CLASSES =
  'rounded-sm border border-ink/40 bg-panel px-2 py-1.5 aria-[invalid=true]:border-diverged aria-[invalid=true]:border-2';

type FieldProps = {
  label: string;
  hint?: ReactNode;
  error?: string;
  className?: string;
  children: (ids: { inputId: string; describedBy: string | undefined; invalid: boolean }) => ReactNode;
};

/** A label, the control, a hint and the field's problem in words, wired for screen readers. */
export function Field({ label, hint, error, className = '', children }: FieldProps) {
  const inputId = useId();
  const hintId = useId();
  const errorId = useId();
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className={`flex flex-col gap-1 text-sm ${className}`}>
      <label htmlFor={inputId} className="font-medium">
        {label}
      </label>
      {children({ inputId, describedBy, invalid: Boolean(error) })}
      {hint ? (
        <p id={hintId} className="text-xs text-ink/70">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={errorId} className="text-xs font-medium text-diverged">
          {error}
        </p>
      ) : null}
    </div>
  );
}
