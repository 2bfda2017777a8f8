import { useState } from 'react';
import { Button } from '../../../../components/ui/button';
import { CautionBlock } from '../../../../components/ui/caution-block';
import { Dialog } from '../../../../components/ui/dialog';
import { useActivateVersion } from '../../api/activate-version';
import type { Version } from '../../types';
import { ActionError } from './action-error';

type ActivateDialogProps = { version: Version; loopTag: string; activeNumber: number | null; onClose: () => void };

/** Activation puts the model on the live twin, so the cautions are read and acknowledged first. */
export function ActivateDialog({ version, loopTag, activeNumber, onClose }: ActivateDialogProps) {
  const [read, setRead] = useState(false);
  const activate = useActivateVersion(version.id);

  return (
    <Dialog title={`Activate version ${version.number} on the twin of ${loopTag}`} onClose={onClose}>
      <p>
        The twin of {loopTag} switches to version {version.number} at its next sample.
        {activeNumber !== null
          ? ` Version ${activeNumber}, active now, is retired.`
          : ' The loop has no active version yet, so its twin starts.'}
      </p>
      <CautionBlock heading="Cautions" />
      <label className="flex items-start gap-2 font-medium">
        <input
          type="checkbox"
          className="mt-0.5 size-4 accent-ink"
          checked={read}
          onChange={(e) => setRead(e.target.checked)}
        />
        I have read the cautions
      </label>
      <ActionError error={activate.error} />
      <div className="flex gap-2">
        <Button
          variant="primary"
          disabled={!read || activate.isPending}
          onClick={() => activate.mutate({ acknowledgeCautions: true }, { onSuccess: onClose })}
        >
          {activate.isPending ? 'Activating…' : `Activate version ${version.number}`}
        </Button>
        <Button variant="quiet" onClick={onClose}>
          Cancel
        </Button>
      </div>
    </Dialog>
  );
}
