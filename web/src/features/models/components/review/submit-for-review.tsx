import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Button } from '../../../../components/ui/button';
import { Field, INPUT_CLASSES } from '../../../../components/ui/field';
import { backtestKeys } from '../../../backtests/api/backtest-keys';
import { EvidencePicker } from '../../../backtests/components/evidence-picker';
import { useSubmitVersion, type SubmitBody } from '../../api/submit-version';
import type { Version } from '../../types';
import { ActionError } from './action-error';

/** Sends a draft to review, with the backtests ticked as evidence; a model that is not stable needs a reason the reviewer can weigh. */
export function SubmitForReview({ version }: { version: Version }) {
  const [justification, setJustification] = useState('');
  const [backtestIds, setBacktestIds] = useState<string[]>([]);
  const queryClient = useQueryClient();
  const submit = useSubmitVersion(version.id);
  const needsReason = version.analysis.stability !== 'stable';
  const missing = needsReason && justification.trim() === '';

  const send = () => {
    const body: SubmitBody = {
      ...(needsReason ? { justification: justification.trim() } : {}),
      ...(backtestIds.length ? { backtestIds } : {}),
    };
    submit.mutate(body, { onSuccess: () => void queryClient.invalidateQueries({ queryKey: backtestKeys.all }) });
  };

  return (
    <div className="space-y-2">
      {needsReason ? (
        <Field
          label="Why this model should run although it is not stable"
          hint={`The analysis calls it ${version.analysis.stability}. Say why that is right for this loop (e.g. the process integrates) — the reviewer needs this.`}
        >
          {({ inputId, describedBy }) => (
            <textarea
              id={inputId}
              aria-describedby={describedBy}
              rows={3}
              value={justification}
              onChange={(e) => setJustification(e.target.value)}
              className={`w-full max-w-2xl ${INPUT_CLASSES}`}
            />
          )}
        </Field>
      ) : null}
      <EvidencePicker version={version} picked={backtestIds} onChange={setBacktestIds} />
      <Button variant="primary" disabled={missing || submit.isPending} onClick={send}>
        {submit.isPending ? 'Submitting…' : 'Submit for review'}
      </Button>
      <ActionError error={submit.error} />
    </div>
  );
}
