import { useState } from 'react';
import { NoteField } from '../../../components/ui/note-field';
import { Button } from '../../../components/ui/button';
import type { Loop } from '../../loops/api/get-loops';
import { useSetMaintenance } from '../api/set-maintenance';
import { serverErrors, topLevelField } from '../utils/server-errors';
import { FormError } from './form-error';

function StateSentence({ maintenance, tag }: { maintenance: boolean; tag: string }) {
  return maintenance ? (
    <p className="font-medium">
      {tag} is in maintenance: its rules&apos; raises are recorded, and nobody is called or e-mailed.
    </p>
  ) : (
    <p className="font-medium">{tag} is in normal service: a raise calls the on-call engineer.</p>
  );
}

/** Puts the loop into maintenance or back, with a note for the audit log. */
export function MaintenanceSwitch({ loop }: { loop: Loop }) {
  const [note, setNote] = useState('');
  const [problem, setProblem] = useState<string | undefined>();
  const change = useSetMaintenance(loop.id);
  const answered = (change.data as { maintenance?: unknown } | undefined)?.maintenance;
  const maintenance = typeof answered === 'boolean' ? answered : loop.maintenance;
  const server = serverErrors(change.error, topLevelField(['note']));
  const switchTo = (next: boolean) => {
    if (!note.trim()) return setProblem('Say why, for example the work order.');
    setProblem(undefined);
    change.mutate({ maintenance: next, note: note.trim() }, { onSuccess: () => setNote('') });
  };
  return (
    <section
      aria-label="Maintenance"
      className="max-w-3xl space-y-2 rounded-sm border border-rule bg-panel px-4 py-3 text-sm"
    >
      <h2 className="font-bold">Maintenance</h2>
      <StateSentence maintenance={maintenance} tag={loop.tag} />
      <p className="text-ink/75">
        While a loop is in maintenance, its drift rules keep watching and every raise is recorded, but no alert calls
        anyone. Alerts already open stay as they are.
      </p>
      <NoteField label="Why" rows={3} value={note} onChange={setNote} error={problem ?? server.fields.note} />
      <FormError message={server.general} />
      <div className="flex gap-2">
        {maintenance !== true ? (
          <Button variant="primary" disabled={change.isPending} onClick={() => switchTo(true)}>
            Put into maintenance
          </Button>
        ) : null}
        {maintenance !== false ? (
          <Button variant="primary" disabled={change.isPending} onClick={() => switchTo(false)}>
            Back to normal service
          </Button>
        ) : null}
      </div>
    </section>
  );
}
