/** A quiet placeholder that holds the page's place while its first data arrives. */
export function PageLoading() {
  return (
    <div role="status" className="space-y-3">
      <span className="block h-7 w-64 animate-pulse rounded-sm bg-rule/70" />
      <span className="block h-40 animate-pulse rounded-sm bg-rule/40" />
      <span className="sr-only">Loading…</span>
    </div>
  );
}
