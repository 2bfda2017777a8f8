import { useState } from 'react';
import { Button } from '../../../../components/ui/button';
import { Field, INPUT_CLASSES } from '../../../../components/ui/field';
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
      <Field label="Note (optional)">
        {({ inputId }) => (
          <textarea
            id={inputId}
            rows={2}
            value={note}
            onChange={(e) => setNote(e.target.value)}
            className={`w-full max-w-2xl ${INPUT_CLASSES}`}
          />
        )}
      </Field>
      <div className="flex gap-2">
        <Button
          variant="danger"
          disabled={retire.isPending}
          onClick={() => retire.mutate(note.trim() ? { note: note.trim() } : {})}
        >
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
