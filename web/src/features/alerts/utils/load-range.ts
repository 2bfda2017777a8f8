export const LOAD_RANGES = [
  { key: '24h', label: '24 h', days: 1 },
  { key: '7d', label: '7 days', days: 7 },
  { key: '30d', label: '30 days', days: 30 },
  { key: '90d', label: '90 days', days: 90 },
] as const;

export type LoadRangeKey = (typeof LOAD_RANGES)[number]['key'];
export type LoadRange = { kind: 'recent'; key: LoadRangeKey } | { kind: 'fixed'; fromMs: number; toMs: number };

const DAY_MS = 86_400_000;

/** The report's range from the address: `?range=30d`, or `?from=…&to=…`; 7 days when nothing is said. */
export function readLoadRange(params: URLSearchParams): LoadRange {
  const fromMs = Date.parse(params.get('from') ?? '');
  const toMs = Date.parse(params.get('to') ?? '');
  if (Number.isFinite(fromMs) && Number.isFinite(toMs) && fromMs < toMs) return { kind: 'fixed', fromMs, toMs };
  const key = LOAD_RANGES.find((r) => r.key === params.get('range'))?.key ?? '7d';
  return { kind: 'recent', key };
}

export function writeLoadRange(range: LoadRange): URLSearchParams {
  if (range.kind === 'fixed') {
    return new URLSearchParams({ from: new Date(range.fromMs).toISOString(), to: new Date(range.toMs).toISOString() });
  }
  return new URLSearchParams(range.key === '7d' ? {} : { range: range.key });
}

/** The instants asked for; a recent range ends at `nowMs`, which the caller rounds to keep the cache key still. */
export function loadWindow(range: LoadRange, nowMs: number): { from: string; to: string } {
  if (range.kind === 'fixed') {
    return { from: new Date(range.fromMs).toISOString(), to: new Date(range.toMs).toISOString() };
  }
  const days = LOAD_RANGES.find((r) => r.key === range.key)?.days ?? 7;
  return { from: new Date(nowMs - days * DAY_MS).toISOString(), to: new Date(nowMs).toISOString() };
}
