import { formatDuration } from '../../../lib/format-number';
import { formatPlantTime } from '../../../lib/plant-time';

/** The default shelf: four hours, or less where the site allows less. */
export const defaultShelveHours = (maxHours: number) => Math.min(4, maxHours);

/** What is wrong with a chosen end of the shelf, or null. */
export function shelveUntilProblem(untilMs: number, nowMs: number, maxHours: number, timeZone: string): string | null {
  if (Number.isNaN(untilMs)) return 'Enter the date and time the shelf should end.';
  if (untilMs <= nowMs) return 'Choose a time in the future.';
  const latest = nowMs + maxHours * 3_600_000;
  if (untilMs > latest) {
    return `Shelve for at most ${formatDuration(maxHours * 3600)}: until ${formatPlantTime(latest, timeZone, { date: true, seconds: false })} at the latest.`;
  }
  return null;
}
