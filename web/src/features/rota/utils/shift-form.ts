import type { Shift } from '@shadowloop/api/contracts';
import { fromPlantWallTime, toPlantWallTime } from '../../../lib/plant-time';
import type { SaveShiftBody } from '../api/shift-changes';

/** The shift form as typed: times are plant wall-clock text of `<input type="datetime-local">`. */
export type ShiftFormValues = {
  userId: string;
  /** '' for plant-wide. */
  area: string;
  position: Shift['position'];
  startsAt: string;
  endsAt: string;
  note: string;
};

export type ShiftFormProblems = Partial<Record<keyof ShiftFormValues, string>>;

export function valuesOfShift(shift: Shift, timeZone: string): ShiftFormValues {
  return {
    userId: shift.user.id,
    area: shift.area ?? '',
    position: shift.position,
    startsAt: toPlantWallTime(Date.parse(shift.startsAt), timeZone),
    endsAt: toPlantWallTime(Date.parse(shift.endsAt), timeZone),
    note: shift.note,
  };
}

/** A new shift: a day from 08:00 plant time on the given date. */
export function newShiftValues(date: string, timeZone: string): ShiftFormValues {
  const startMs = fromPlantWallTime(`${date}T08:00`, timeZone);
  return {
    userId: '',
    area: '',
    position: 'primary',
    startsAt: `${date}T08:00`,
    endsAt: toPlantWallTime(startMs + 86_400_000, timeZone),
    note: '',
  };
}

export function shiftBody(
  values: ShiftFormValues,
  timeZone: string,
): { body: SaveShiftBody; problems: null } | { body: null; problems: ShiftFormProblems } {
  const problems: ShiftFormProblems = {};
  const startMs = fromPlantWallTime(values.startsAt, timeZone);
  const endMs = fromPlantWallTime(values.endsAt, timeZone);
  if (!values.userId) problems.userId = 'Choose who is on call.';
  if (Number.isNaN(startMs)) problems.startsAt = 'Enter when the shift starts.';
  if (Number.isNaN(endMs)) problems.endsAt = 'Enter when the shift ends.';
  else if (endMs <= startMs) problems.endsAt = 'The shift must end after it starts.';
  if (Object.keys(problems).length) return { body: null, problems };
  return {
    body: {
      userId: values.userId,
      area: values.area || null,
      position: values.position,
      startsAt: new Date(startMs).toISOString(),
      endsAt: new Date(endMs).toISOString(),
      note: values.note.trim(),
    },
    problems: null,
  };
}
