/** A share 0…1 as a percentage and a thin bar beside it. */
export function ShareBar({ share }: { share: number }) {
  const percent = Math.max(0, Math.min(100, share * 100));
  return (
    <span className="inline-flex items-center gap-2 tabular-nums">
      <span aria-hidden="true" className="inline-block h-2 w-24 rounded-sm bg-rule">
        <span className="block h-2 rounded-sm bg-ink" style={{ width: `${percent}%` }} />
      </span>
      {Math.round(percent)} %
    </span>
  );
}
