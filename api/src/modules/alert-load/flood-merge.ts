/** Length of the counting window of the alert-load report (ISA-18.2 / EEMUA 191 rates per 10 minutes). */
export const WINDOW_MS = 600_000;

export interface WindowCount {
  /** ISO start of a 10-minute window. */
  start: string;
  count: number;
}

export interface Flood {
  start: string;
  /** End of the flood's last window. */
  end: string;
  /** Activations in the flood's windows. */
  count: number;
}

/**
 * Alert floods (ISA-18.2 / EEMUA 191: more alerts in 10 minutes than a person can handle): every
 * window with more than `floodPer10Min` activations, runs of back-to-back such windows merged
 * into one flood. Windows may come in any order; windows with no activation may be left out.
 */
export function mergeFloods(windows: readonly WindowCount[], floodPer10Min: number, windowMs = WINDOW_MS): Flood[] {
  const over = windows
    .filter((w) => w.count > floodPer10Min)
    .map((w) => ({ startMs: Date.parse(w.start), count: w.count }))
    .sort((a, b) => a.startMs - b.startMs);
  const runs: { startMs: number; endMs: number; count: number }[] = [];
  for (const w of over) {
    const last = runs.at(-1);
    if (last && w.startMs === last.endMs) {
      last.endMs += windowMs;
      last.count += w.count;
    } else runs.push({ startMs: w.startMs, endMs: w.startMs + windowMs, count: w.count });
  }
  return runs.map((r) => ({
    start: new Date(r.startMs).toISOString(),
    end: new Date(r.endMs).toISOString(),
    count: r.count,
  }));
}
