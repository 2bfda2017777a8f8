import type { Alert } from '@shadowloop/api/contracts';
import { useState } from 'react';
import { describeError } from '../../../components/errors/describe-error';
import { Button } from '../../../components/ui/button';
import { INPUT_CLASSES } from '../../../components/ui/field';
import { plural } from '../../../lib/format-number';
import { useAcknowledgeAlerts, type BulkAcknowledgeResult } from '../api/acknowledge-alerts';
import { RULE_WORDS } from '../utils/alert-words';

type BulkAcknowledgeProps = {
  selectedIds: string[];
  alerts: Alert[];
  onDone: () => void;
};

function nameOf(alertId: string, alerts: Alert[]): string {
  const alert = alerts.find((a) => a.id === alertId);
  return alert ? `alert ${alert.number} (${alert.loopTag} ${RULE_WORDS[alert.rule]})` : `alert ${alertId}`;
}

function ResultMessage({ result, alerts }: { result: BulkAcknowledgeResult; alerts: Alert[] }) {
  return (
    <div role="status" className="rounded-sm border border-rule border-l-4 border-l-in-step bg-panel px-3 py-2 text-sm">
      <p className="font-medium">Acknowledged {plural(result.acknowledged.length, 'alert')}.</p>
      {result.skipped.length ? (
        <>
          <p className="mt-1">Skipped {plural(result.skipped.length, 'alert')}:</p>
          <ul className="list-disc pl-5">
            {result.skipped.map((skip) => (
              <li key={skip.id}>
                {nameOf(skip.id, alerts)}: {skip.reason}
              </li>
            ))}
          </ul>
        </>
      ) : null}
    </div>
  );
}

/** Acknowledges the ticked alerts at once, with one note; says which ones the server skipped and why. */
export function BulkAcknowledge({ selectedIds, alerts, onDone }: BulkAcknowledgeProps) {
  const [note, setNote] = useState('');
  const acknowledge = useAcknowledgeAlerts();
  // Names are taken when the answer comes, before the lists refresh without the acknowledged alerts.
  const [named, setNamed] = useState<Alert[]>([]);
  const submit = () => {
    setNamed(alerts);
    acknowledge.mutate(
      { ids: selectedIds, note: note.trim() },
      {
        onSuccess: () => {
          setNote('');
          onDone();
        },
      },
    );
  };
  return (
    <div className="space-y-2">
      <form
        aria-label="Acknowledge the selected alerts"
        onSubmit={(e) => {
          e.preventDefault();
          submit();
        }}
        className="flex flex-wrap items-end gap-3 rounded-sm border border-rule bg-panel px-3 py-2"
      >
        <p className="text-sm font-medium tabular-nums">{plural(selectedIds.length, 'alert')} selected</p>
        <label className="flex flex-col gap-1 text-sm">
          <span className="font-medium">Note for the timeline (optional)</span>
          <input value={note} onChange={(e) => setNote(e.target.value)} className={`w-72 ${INPUT_CLASSES}`} />
        </label>
        <Button type="submit" variant="primary" disabled={selectedIds.length === 0 || acknowledge.isPending}>
          Acknowledge selected
        </Button>
      </form>
      {acknowledge.isError ? (
        <p role="alert" className="text-sm text-diverged">
          {describeError(acknowledge.error).explanation}
        </p>
      ) : null}
      {acknowledge.data ? <ResultMessage result={acknowledge.data} alerts={named} /> : null}
    </div>
  );
}
