import type { Shift } from '@shadowloop/api/contracts';
import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Field, INPUT_CLASSES } from '../../../components/ui/field';
import { FormError } from '../../alerts/components/form-error';
import { serverErrors } from '../../alerts/utils/server-errors';
import { deleteShift, swapShifts, useRotaChange } from '../api/shift-changes';
import { shiftDescription } from './shift-block';

type Props = { shift: Shift; others: Shift[]; timeZone: string; onDone: () => void };

const noField = () => null;

export function SwapShift({ shift, others, timeZone, onDone }: Props) {
  const [withShiftId, setWithShiftId] = useState('');
  const swap = useRotaChange((otherId: string) => swapShifts(shift.id, otherId));
  if (others.length === 0) return <p className="text-sm text-ink/75">No other shift this week to swap with.</p>;
  return (
    <form
      aria-label="Swap the shift"
      className="space-y-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (withShiftId) swap.mutate(withShiftId, { onSuccess: onDone });
      }}
    >
      <Field label="Swap with…" hint="The two people trade places; times, areas and positions stay as they are.">
        {({ inputId, describedBy }) => (
          <select
            id={inputId}
            aria-describedby={describedBy}
            value={withShiftId}
            onChange={(e) => setWithShiftId(e.target.value)}
            className={INPUT_CLASSES}
          >
            <option value="">Choose another shift…</option>
            {others.map((other) => (
              <option key={other.id} value={other.id}>
                {shiftDescription(other, timeZone)}
              </option>
            ))}
          </select>
        )}
      </Field>
      <FormError message={serverErrors(swap.error, noField).general} />
      <Button type="submit" disabled={!withShiftId || swap.isPending}>
        Swap the two shifts
      </Button>
    </form>
  );
}

export function DeleteShift({ shift, onDone }: Pick<Props, 'shift' | 'onDone'>) {
  const [confirming, setConfirming] = useState(false);
  const remove = useRotaChange(() => deleteShift(shift.id));
  return (
    <div className="space-y-2">
      {confirming ? (
        <div className="flex flex-wrap items-center gap-2">
          <span className="text-sm">
            Delete the shift of {shift.user.name}? Nobody will cover it unless another shift does.
          </span>
          <Button
            variant="danger"
            disabled={remove.isPending}
            onClick={() => remove.mutate(undefined, { onSuccess: onDone })}
          >
            Delete it
          </Button>
          <Button variant="quiet" onClick={() => setConfirming(false)}>
            Keep it
          </Button>
        </div>
      ) : (
        <Button variant="danger" onClick={() => setConfirming(true)}>
          Delete the shift…
        </Button>
      )}
      <FormError message={serverErrors(remove.error, noField).general} />
    </div>
  );
}
