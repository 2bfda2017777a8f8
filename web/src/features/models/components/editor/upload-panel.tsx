import { useState } from 'react';
import { describeError } from '../../../../components/errors/describe-error';
import { Button } from '../../../../components/ui/button';
import { isApiError } from '../../../../lib/api';
import { useUploadModelFiles } from '../../api/upload-model-files';
import type { UploadedModel, UploadProblem } from '../../types';
import { UploadProblems } from './upload-problems';

type UploadPanelProps = { loopId: string; onRead: (model: UploadedModel) => void };

function uploadProblems(error: unknown): UploadProblem[] {
  return isApiError(error) && error.status === 400 && Array.isArray(error.details)
    ? (error.details as UploadProblem[])
    : [];
}

export function UploadPanel({ loopId, onRead }: UploadPanelProps) {
  const [files, setFiles] = useState<File[]>([]);
  const upload = useUploadModelFiles(loopId);
  const problems = upload.isError ? uploadProblems(upload.error) : [];

  return (
    <div className="space-y-3 text-sm">
      <p className="max-w-3xl">
        Choose one JSON file holding the matrices (<code>{'{"A": [[…]], "B": [[…]]}'}</code>, optionally C and D, or Ac
        and Bc for a continuous model), or one CSV file per matrix named after it: <code>A.csv</code>,{' '}
        <code>B.csv</code>, <code>C.csv</code>, <code>D.csv</code>, or <code>Ac.csv</code> and <code>Bc.csv</code>. The
        files are only read to fill the editor; nothing is saved until you save the version.
      </p>
      <div className="flex flex-wrap items-end gap-3">
        <label className="flex flex-col gap-1">
          <span className="font-medium">Model files</span>
          <input
            type="file"
            multiple
            accept=".json,.csv,application/json,text/csv"
            onChange={(event) => {
              upload.reset();
              setFiles(Array.from(event.target.files ?? []));
            }}
          />
        </label>
        <Button
          variant="primary"
          disabled={files.length === 0 || upload.isPending}
          onClick={() => upload.mutate(files, { onSuccess: onRead })}
        >
          {upload.isPending ? 'Reading…' : 'Read the files into the editor'}
        </Button>
      </div>
      {problems.length > 0 ? <UploadProblems problems={problems} /> : null}
      {upload.isError && problems.length === 0 ? (
        <p role="alert" className="font-medium text-diverged">
          {describeError(upload.error).explanation} {describeError(upload.error).nextStep}
        </p>
      ) : null}
    </div>
  );
}
