import { useState } from 'react';
import { Button } from '../../../../components/ui/button';
import { Field, INPUT_CLASSES } from '../../../../components/ui/field';
import { useSubmitVersion } from '../../api/submit-version';
import type { Version } from '../../types';
import { ActionError } from './action-error';

/** Sends a draft to review; a model that is not stable needs a reason the reviewer can weigh. */
export function SubmitForReview({ version }: { version: Version }) {
  const [justification, setJustification] = useState('');
  const submit = useSubmitVersion(version.id);
  const needsReason = version.analysis.stability !== 'stable';
  const missing = needsReason && justification.trim() === '';

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
      <Button
        variant="primary"
        disabled={missing || submit.isPending}
        onClick={() => submit.mutate(needsReason ? { justification: justification.trim() } : {})}
      >
        {submit.isPending ? 'Submitting…' : 'Submit for review'}
      </Button>
      <ActionError error={submit.error} />
    </div>
  );
}
