import { fromPlantWallTime, toPlantWallTime } from '../../../lib/plant-time';

/** A plant calendar day, `2025-06-02`, and the instants its midnight and the next one name. */
export type PlantDay = { date: string; startMs: number; endMs: number; label: string };

const DAY_NAMES = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const DATE_PATTERN = /^\d{4}-\d{2}-\d{2}$/;

const utcOf = (date: string) => Date.parse(`${date}T00:00:00Z`);
const dateOfUtc = (ms: number) => new Date(ms).toISOString().slice(0, 10);

export function addDays(date: string, days: number): string {
  return dateOfUtc(utcOf(date) + days * 86_400_000);
}

export function isPlantDate(text: string | null): text is string {
  return text !== null && DATE_PATTERN.test(text) && !Number.isNaN(utcOf(text));
}

/** The plant date of an instant. */
export function plantDateOf(ms: number, timeZone: string): string {
  return toPlantWallTime(ms, timeZone).slice(0, 10);
}

/** The Monday of the plant week that holds `date`. */
export function mondayOf(date: string): string {
  const weekday = new Date(utcOf(date)).getUTCDay();
  return addDays(date, -((weekday + 6) % 7));
}

export function dayLabel(date: string): string {
  const d = new Date(utcOf(date));
  return `${DAY_NAMES[d.getUTCDay()]} ${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]}`;
}

/** Seven plant days from a Monday; a day of a clock change is 23 or 25 hours long. */
export function weekDays(monday: string, timeZone: string): PlantDay[] {
  return Array.from({ length: 7 }, (_, i) => {
    const date = addDays(monday, i);
    return {
      date,
      startMs: fromPlantWallTime(`${date}T00:00`, timeZone),
      endMs: fromPlantWallTime(`${addDays(date, 1)}T00:00`, timeZone),
      label: dayLabel(date),
    };
  });
}

export type DaySegment = { leftPercent: number; widthPercent: number; startsBefore: boolean; endsAfter: boolean };

/** The part of a shift that falls on one day, placed by time across the day; null when none does. */
export function segmentOn(shift: { startsAt: string; endsAt: string }, day: PlantDay): DaySegment | null {
  const start = Date.parse(shift.startsAt);
  const end = Date.parse(shift.endsAt);
  const from = Math.max(start, day.startMs);
  const to = Math.min(end, day.endMs);
  if (!(to > from)) return null;
  const length = day.endMs - day.startMs;
  return {
    leftPercent: ((from - day.startMs) / length) * 100,
    widthPercent: ((to - from) / length) * 100,
    startsBefore: start < day.startMs,
    endsAfter: end > day.endMs,
  };
}
