import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { NoteField, optionalNote } from '../../../components/ui/note-field';
import { ActionError } from '../../models/components/review/action-error';
import { useAttachEvidence, useDetachEvidence } from '../api/change-evidence';

type AttachEvidenceProps = { backtestId: string; version: { id: string; number: number }; attached: boolean };

/** Attach this backtest to a draft or a version in review, with a note the reviewer reads; or take it off again. */
export function AttachEvidence({ backtestId, version, attached }: AttachEvidenceProps) {
  const [open, setOpen] = useState(false);
  const [note, setNote] = useState('');
  const attach = useAttachEvidence();
  const detach = useDetachEvidence();
  const request = { versionId: version.id, backtestId };

  if (attached) {
    return (
      <div className="flex flex-wrap items-center gap-2 text-sm">
        <span className="font-medium">Attached as evidence to version {version.number}.</span>
        <Button variant="quiet" disabled={detach.isPending} onClick={() => detach.mutate(request)}>
          {detach.isPending ? 'Taking it off…' : `Take it off version ${version.number}`}
        </Button>
        <ActionError error={detach.error} />
      </div>
    );
  }
  if (!open) {
    return <Button onClick={() => setOpen(true)}>Attach as evidence to version {version.number}</Button>;
  }
  return (
    <div className="space-y-2 rounded-sm border border-rule bg-paper p-3 text-sm">
      <NoteField
        label="Note for the reviewer (optional)"
        hint="What this backtest shows, e.g. the week of the diffuser cleaning."
        value={note}
        onChange={setNote}
      />
      <div className="flex gap-2">
        <Button
          variant="primary"
          disabled={attach.isPending}
          onClick={() => attach.mutate({ ...request, ...optionalNote(note) }, { onSuccess: () => setOpen(false) })}
        >
          {attach.isPending ? 'Attaching…' : `Attach to version ${version.number}`}
        </Button>
        <Button variant="quiet" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
      <ActionError error={attach.error} />
    </div>
  );
}
