/**
 * Times on the plant's clock (an IANA zone such as Europe/London), whatever the browser's zone:
 * shown with the zone's abbreviation, and read back from the wall-clock text a person typed.
 */

type Parts = { year: number; month: number; day: number; hour: number; minute: number; second: number };

function partsIn(timeZone: string, ms: number): Parts & { zone: string } {
  const formatted = new Intl.DateTimeFormat('en-GB', {
    timeZone,
    hourCycle: 'h23',
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    hour: '2-digit',
    minute: '2-digit',
    second: '2-digit',
    timeZoneName: 'short',
  }).formatToParts(new Date(ms));
  const get = (type: Intl.DateTimeFormatPartTypes) => formatted.find((p) => p.type === type)?.value ?? '';
  const n = (type: Intl.DateTimeFormatPartTypes) => Number(get(type));
  return {
    year: n('year'),
    month: n('month'),
    day: n('day'),
    hour: n('hour'),
    minute: n('minute'),
    second: n('second'),
    zone: get('timeZoneName'),
  };
}

const pad = (n: number) => String(n).padStart(2, '0');

/** `14:03:20 BST`, or with the date `2025-06-01 14:03:20 BST`. */
export function formatPlantTime(
  ms: number,
  timeZone: string,
  options: { date?: boolean; seconds?: boolean } = {},
): string {
  if (!Number.isFinite(ms)) return '—';
  const p = partsIn(timeZone, ms);
  const time = `${pad(p.hour)}:${pad(p.minute)}${options.seconds === false ? '' : `:${pad(p.second)}`}`;
  const date = options.date ? `${p.year}-${pad(p.month)}-${pad(p.day)} ` : '';
  return `${date}${time} ${p.zone}`;
}

/** The value of an `<input type="datetime-local">` showing this instant on the plant's clock. */
export function toPlantWallTime(ms: number, timeZone: string): string {
  const p = partsIn(timeZone, ms);
  return `${p.year}-${pad(p.month)}-${pad(p.day)}T${pad(p.hour)}:${pad(p.minute)}`;
}

function offsetMs(timeZone: string, ms: number): number {
  const p = partsIn(timeZone, ms);
  return Date.UTC(p.year, p.month - 1, p.day, p.hour, p.minute, p.second) - Math.floor(ms / 1000) * 1000;
}

/** The instant a plant wall-clock time (`2025-06-01T14:03`) names; NaN for text that is not one. */
export function fromPlantWallTime(wall: string, timeZone: string): number {
  const asUtc = Date.parse(`${wall}${wall.length === 16 ? ':00' : ''}Z`);
  if (Number.isNaN(asUtc)) return NaN;
  const first = asUtc - offsetMs(timeZone, asUtc);
  const second = asUtc - offsetMs(timeZone, first);
  return second;
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** A chart tick on the plant's 24-hour clock: `01:25`, `01:25:30` over a few minutes, `2 Dec 01:00` over days. */
export function formatAxisTime(ms: number, timeZone: string, spanMs: number): string {
  const p = partsIn(timeZone, ms);
  const time = `${pad(p.hour)}:${pad(p.minute)}${spanMs <= 5 * 60_000 ? `:${pad(p.second)}` : ''}`;
  return spanMs > 36 * 3_600_000 ? `${p.day} ${MONTHS[p.month - 1]} ${time}` : time;
}

/** An ISO instant as `2025-06-01 14:03:20 BST` on the plant's clock; '—' when missing or not a time. */
export function formatPlantTimestamp(iso: string | null | undefined, timeZone: string): string {
  const ms = Date.parse(iso ?? '');
  return Number.isNaN(ms) ? '—' : formatPlantTime(ms, timeZone, { date: true });
}
