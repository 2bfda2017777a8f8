import { useState } from 'react';
import { Button } from '../../../../components/ui/button';
import { NoteField, optionalNote } from '../../../../components/ui/note-field';
import { useApproveVersion } from '../../api/approve-version';
import { useRejectVersion } from '../../api/reject-version';
import type { Version } from '../../types';
import { ActionError } from './action-error';

/** Approve with an optional note, or send back with a reason the author can act on. */
export function ReviewDecision({ version }: { version: Version }) {
  const [note, setNote] = useState('');
  const [rejecting, setRejecting] = useState(false);
  const [reason, setReason] = useState('');
  const approve = useApproveVersion(version.id);
  const reject = useRejectVersion(version.id);
  const busy = approve.isPending || reject.isPending;

  return (
    <div className="space-y-3">
      <p className="text-sm">
        {version.author?.name ?? 'Another engineer'} asks for your review. Read the verdict, the modes and the step
        responses below, and compare with the active version before you decide.
      </p>
      {version.justification ? (
        <p className="rounded-sm border-l-4 border-l-drifting bg-panel px-3 py-2 text-sm">
          <strong>The author&apos;s reason for a model that is not stable:</strong> {version.justification}
        </p>
      ) : null}
      <NoteField label="Review note (optional)" value={note} onChange={setNote} />
      <div className="flex flex-wrap gap-2">
        <Button variant="primary" disabled={busy} onClick={() => approve.mutate(optionalNote(note))}>
          {approve.isPending ? 'Approving…' : 'Approve'}
        </Button>
        <Button variant="danger" disabled={busy} onClick={() => setRejecting(true)}>
          Reject…
        </Button>
      </div>
      {rejecting ? (
        <div className="space-y-2 rounded-sm border border-rule bg-panel p-3">
          <NoteField
            label="Reason for rejecting"
            hint="The author reads this to make a better version."
            value={reason}
            onChange={setReason}
          />
          <div className="flex gap-2">
            <Button
              variant="danger"
              disabled={busy || reason.trim() === ''}
              onClick={() => reject.mutate({ reason: reason.trim() })}
            >
              {reject.isPending ? 'Rejecting…' : 'Reject with this reason'}
            </Button>
            <Button variant="quiet" onClick={() => setRejecting(false)}>
              Cancel
            </Button>
          </div>
        </div>
      ) : null}
      <ActionError error={approve.error ?? reject.error} />
    </div>
  );
}
