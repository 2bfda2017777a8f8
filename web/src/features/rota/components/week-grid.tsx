import type { Shift } from '@shadowloop/api/contracts';
import { Th } from '../../../components/ui/table';
import type { PlantDay } from '../utils/week';
import { segmentOn } from '../utils/week';
import { ShiftBlock } from './shift-block';

export type RotaRow = { area: string | null; name: string };

const POSITIONS = ['primary', 'secondary'] as const;

type WeekGridProps = {
  rows: RotaRow[];
  days: PlantDay[];
  today: string;
  shifts: Shift[];
  timeZone: string;
  onOpen?: (shift: Shift) => void;
};

type DayCellProps = { row: RotaRow; day: PlantDay } & Omit<WeekGridProps, 'rows' | 'days' | 'today'>;

function DayCell({ row, day, shifts, timeZone, onOpen }: DayCellProps) {
  const own = shifts.filter((shift) => shift.area === row.area);
  return (
    <td aria-label={`${row.name}, ${day.label}`} className="border-b border-l border-rule p-1 align-top">
      {POSITIONS.map((position) => (
        <div key={position} className="relative my-0.5 h-6">
          {own
            .filter((shift) => shift.position === position)
            .map((shift) => {
              const segment = segmentOn(shift, day);
              return segment ? (
                <ShiftBlock key={shift.id} shift={shift} segment={segment} timeZone={timeZone} onOpen={onOpen} />
              ) : null;
            })}
        </div>
      ))}
    </td>
  );
}

/** Seven plant days across, plant-wide and then each area down; each shift drawn by its hours. */
export function WeekGrid({ rows, days, today, shifts, timeZone, onOpen }: WeekGridProps) {
  return (
    <div className="overflow-x-auto rounded-sm border border-rule bg-panel">
      <table className="w-full min-w-[56rem] table-fixed border-collapse text-sm">
        <caption className="sr-only">On-call shifts of the week, by area and day</caption>
        <thead>
          <tr>
            <Th className="w-40">Area</Th>
            {days.map((day) => (
              <Th key={day.date} className={day.date === today ? 'bg-twin/10 text-ink' : ''}>
                {day.label}
                {day.date === today ? <span className="ml-1 normal-case">(today)</span> : null}
              </Th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.area ?? 'plant-wide'}>
              <th scope="row" className="border-b border-rule p-1 pl-2 text-left align-top font-medium">
                <div className="flex justify-between gap-2">
                  <span className="my-0.5 leading-6">{row.name}</span>
                  <span className="text-right text-xs font-normal text-ink/70">
                    {POSITIONS.map((position) => (
                      <span key={position} className="my-0.5 block h-6 leading-6">
                        {position}
                      </span>
                    ))}
                  </span>
                </div>
              </th>
              {days.map((day) => (
                <DayCell key={day.date} row={row} day={day} shifts={shifts} timeZone={timeZone} onOpen={onOpen} />
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
