import type { Shift } from '@shadowloop/api/contracts';
import { Dialog } from '../../../components/ui/dialog';
import type { Area } from '../../loops/api/get-areas';
import type { Person } from '../api/get-people';
import type { ShiftFormValues } from '../utils/shift-form';
import { ShiftForm } from './shift-form';
import { DeleteShift, SwapShift } from './swap-and-delete';

export type ShiftDialogState = { shift: Shift | null; initial: ShiftFormValues };

type ShiftDialogProps = ShiftDialogState & {
  people: Person[];
  areas: Area[];
  weekShifts: Shift[];
  timeZone: string;
  onClose: () => void;
};

/** Add a shift, or change, swap or delete one. */
export function ShiftDialog({ shift, initial, people, areas, weekShifts, timeZone, onClose }: ShiftDialogProps) {
  return (
    <Dialog title={shift ? `Shift of ${shift.user.name}` : 'Add a shift'} onClose={onClose}>
      <ShiftForm shift={shift} initial={initial} people={people} areas={areas} timeZone={timeZone} onDone={onClose} />
      {shift ? (
        <div className="space-y-3 border-t border-rule pt-3">
          <SwapShift
            shift={shift}
            others={weekShifts.filter((s) => s.id !== shift.id)}
            timeZone={timeZone}
            onDone={onClose}
          />
          <DeleteShift shift={shift} onDone={onClose} />
        </div>
      ) : null}
    </Dialog>
  );
}
