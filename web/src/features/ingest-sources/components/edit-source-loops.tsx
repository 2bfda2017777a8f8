import { useState } from 'react';
import { describeError } from '../../../components/errors/describe-error';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import type { IngestSource } from '../api/get-ingest-sources';
import { useSetIngestSourceLoops } from '../api/set-ingest-source-loops';
import { LoopPicker } from './loop-picker';

/** "Change loops…": the loops a source may post for, replaced as a whole. */
export function EditSourceLoops({ source }: { source: IngestSource }) {
  const [open, setOpen] = useState(false);
  const [loopIds, setLoopIds] = useState<string[]>([]);
  const save = useSetIngestSourceLoops(source.id);
  const start = () => {
    setLoopIds(source.loops.map((l) => l.id));
    save.reset();
    setOpen(true);
  };

  if (source.revokedAt) return null;
  return (
    <>
      <Button onClick={start} aria-label={`Change the loops of ${source.name}`}>
        Change loops…
      </Button>
      {open ? (
        <Dialog title={`Loops ${source.name} may post for`} onClose={() => setOpen(false)}>
          <LoopPicker selected={loopIds} onChange={setLoopIds} legend="Loops" />
          <p className="text-xs text-ink/75">
            Readings it posts for any other loop are refused from now on. Stored readings stay.
          </p>
          {save.isError ? (
            <p role="alert" className="text-diverged">
              {describeError(save.error).explanation}
            </p>
          ) : null}
          <div className="flex gap-2">
            <Button
              variant="primary"
              disabled={save.isPending}
              onClick={() => save.mutate(loopIds, { onSuccess: () => setOpen(false) })}
            >
              Save loops
            </Button>
            <Button variant="quiet" onClick={() => setOpen(false)}>
              Cancel
            </Button>
          </div>
        </Dialog>
      ) : null}
    </>
  );
}
