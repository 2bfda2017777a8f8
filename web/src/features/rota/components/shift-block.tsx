import type { Shift } from '@shadowloop/api/contracts';
import { formatPlantTime } from '../../../lib/plant-time';
import type { DaySegment } from '../utils/week';

type ShiftBlockProps = {
  shift: Shift;
  segment: DaySegment;
  timeZone: string;
  onOpen?: (shift: Shift) => void;
};

const STYLE = {
  primary: 'bg-ink text-paper border border-ink',
  secondary: 'bg-panel text-ink border border-dashed border-ink',
} as const;

export function shiftDescription(shift: Shift, timeZone: string): string {
  const at = (iso: string) => formatPlantTime(Date.parse(iso), timeZone, { date: true, seconds: false });
  return `${shift.user.name}, ${shift.position}, ${at(shift.startsAt)} to ${at(shift.endsAt)}${shift.note ? ` — ${shift.note}` : ''}`;
}

/** The part of one shift on one day: the person and the position in words, placed by its hours. */
export function ShiftBlock({ shift, segment, timeZone, onOpen }: ShiftBlockProps) {
  const description = shiftDescription(shift, timeZone);
  const text = (
    <>
      {segment.startsBefore ? '… ' : ''}
      {shift.user.name} · {shift.position}
      {segment.endsAfter ? ' …' : ''}
    </>
  );
  const className = `absolute inset-y-0 overflow-hidden truncate whitespace-nowrap rounded-sm px-1 text-left text-xs leading-6 ${STYLE[shift.position]}`;
  const style = { left: `${segment.leftPercent}%`, width: `${segment.widthPercent}%` };
  if (!onOpen) {
    return (
      <span className={className} style={style} title={description}>
        {text}
      </span>
    );
  }
  return (
    <button
      type="button"
      className={`${className} hover:outline-2 hover:outline-twin focus-visible:outline-2 focus-visible:outline-twin`}
      style={style}
      title={description}
      aria-label={`Change the shift: ${description}`}
      onClick={() => onOpen(shift)}
    >
      {text}
    </button>
  );
}
