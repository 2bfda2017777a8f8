import type { AlertState } from '@shadowloop/api/contracts';
import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { isWaiting } from '../utils/alert-words';
import { AcknowledgeForm } from './acknowledge-form';
import { CloseForm } from './close-form';
import { ShelveForm } from './shelve-form';

type Action = 'acknowledge' | 'shelve' | 'close';

type AlertActionsProps = {
  alert: { id: string; number: number; state: AlertState };
  mayAct: boolean;
  timeZone: string;
};

/** Acknowledge, shelve or close, each in its own dialog; only what the alert's state allows. */
export function AlertActions({ alert, mayAct, timeZone }: AlertActionsProps) {
  const [open, setOpen] = useState<Action | null>(null);
  if (!mayAct) {
    return <p className="text-sm text-ink/75">Acknowledging, shelving and closing alerts needs the on-call role.</p>;
  }
  if (alert.state === 'closed')
    return <p className="text-sm text-ink/75">This alert is closed; nothing is left to do.</p>;
  const close = () => setOpen(null);
  return (
    <div className="flex flex-wrap gap-2">
      {isWaiting(alert.state) ? (
        <Button variant="primary" onClick={() => setOpen('acknowledge')}>
          Acknowledge…
        </Button>
      ) : null}
      <Button onClick={() => setOpen('shelve')}>{alert.state === 'shelved' ? 'Change the shelf…' : 'Shelve…'}</Button>
      <Button onClick={() => setOpen('close')}>Close…</Button>
      {open === 'acknowledge' ? (
        <Dialog title={`Acknowledge alert ${alert.number}`} onClose={close}>
          <AcknowledgeForm alertId={alert.id} onDone={close} />
        </Dialog>
      ) : null}
      {open === 'shelve' ? (
        <Dialog title={`Shelve alert ${alert.number}`} onClose={close}>
          <ShelveForm alertId={alert.id} timeZone={timeZone} onDone={close} />
        </Dialog>
      ) : null}
      {open === 'close' ? (
        <Dialog title={`Close alert ${alert.number}`} onClose={close}>
          <CloseForm alertId={alert.id} onDone={close} />
        </Dialog>
      ) : null}
    </div>
  );
}
