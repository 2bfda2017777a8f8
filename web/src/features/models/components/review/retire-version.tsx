import { useState } from 'react';
import { Button } from '../../../../components/ui/button';
import { NoteField, optionalNote } from '../../../../components/ui/note-field';
import { useRetireVersion } from '../../api/retire-version';
import type { Version } from '../../types';
import { ActionError } from './action-error';

export function RetireVersion({ version, loopTag }: { version: Version; loopTag: string }) {
  const [open, setOpen] = useState(false);
  const [note, setNote] = useState('');
  const retire = useRetireVersion(version.id);
  if (!open) {
    return (
      <Button variant="danger" onClick={() => setOpen(true)}>
        Retire…
      </Button>
    );
  }
  return (
    <div className="space-y-2 rounded-sm border border-rule bg-panel p-3 text-sm">
      <p>
        {version.status === 'active'
          ? `Retiring version ${version.number} stops the twin of ${loopTag} until another version is activated.`
          : `Retiring version ${version.number} keeps it from being activated.`}
      </p>
      <NoteField label="Note (optional)" value={note} onChange={setNote} />
      <div className="flex gap-2">
        <Button variant="danger" disabled={retire.isPending} onClick={() => retire.mutate(optionalNote(note))}>
          {retire.isPending ? 'Retiring…' : `Retire version ${version.number}`}
        </Button>
        <Button variant="quiet" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
      <ActionError error={retire.error} />
    </div>
  );
}
