import { useQuery } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { ErrorNotice } from '../../../../components/errors/error-notice';
import { Button } from '../../../../components/ui/button';
import { INPUT_CLASSES } from '../../../../components/ui/field';
import { formatDuration, formatNumber } from '../../../../lib/format-number';
import { parseCellNumber } from '../../../../lib/parse-number';
import { explorationQueryOptions, type ExploreBody } from '../../api/explore-version';
import type { Version } from '../../types';
import { defaultExplorerSteps, defaultInitialState, EXPLORER_STEP_LIMIT } from '../../utils/horizon-defaults';
import { eigenDirections } from '../../utils/phase-plane';
import { FreeResponseCharts } from './free-response-charts';
import { MatrixTable } from './matrix-table';
import { PhasePlane } from './phase-plane';

type ExplorerProps = { version: Version; stateLabels: string[]; samplePeriodS: number };

function readBody(k: string, x0: string[], steps: string): ExploreBody | string {
  const kValue = Number(k);
  const stepsValue = Number(steps);
  if (!Number.isInteger(kValue) || kValue < 0 || kValue > 100_000)
    return 'k must be a whole number of samples from 0 to 100 000.';
  if (!Number.isInteger(stepsValue) || stepsValue < 1 || stepsValue > EXPLORER_STEP_LIMIT)
    return `Show between 1 and ${EXPLORER_STEP_LIMIT} samples.`;
  const values = x0.map((text) => parseCellNumber(text));
  if (values.some((v) => v === null || v === undefined)) return 'Give every state of x0 a number (0 for no deviation).';
  return { k: kValue, x0: values as number[], steps: stepsValue };
}

/** Pick k to see A^k, pick x0 to see where the state goes with the inputs held at the operating point. */
export function TransitionExplorer({ version, stateLabels, samplePeriodS }: ExplorerProps) {
  const n = version.A.length;
  const [k, setK] = useState('10');
  const [steps, setSteps] = useState(String(defaultExplorerSteps(version.analysis, samplePeriodS)));
  const [x0, setX0] = useState(() => defaultInitialState(n));
  const [body, setBody] = useState<ExploreBody>(() => readBody(k, x0, steps) as ExploreBody);
  const [problem, setProblem] = useState<string | null>(null);
  const explored = useQuery(explorationQueryOptions(version.id, body));

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const read = readBody(k, x0, steps);
    setProblem(typeof read === 'string' ? read : null);
    if (typeof read !== 'string') setBody(read);
  };
  const result = explored.data;
  const xk = result?.trajectory[body.k];
  return (
    <div className="space-y-4">
      <form onSubmit={submit} className="flex flex-wrap items-end gap-4 text-sm" aria-label="State transition explorer">
        <label className="flex flex-col gap-1">
          <span className="font-medium">Samples ahead, k</span>
          <input
            value={k}
            onChange={(e) => setK(e.target.value)}
            inputMode="numeric"
            className={`w-24 ${INPUT_CLASSES}`}
          />
        </label>
        <fieldset className="flex flex-wrap items-end gap-2">
          <legend className="mb-1 font-medium">Initial state x0 (deviation from the operating point)</legend>
          {x0.map((value, i) => (
            <label key={i} className="flex flex-col gap-0.5 text-xs">
              <span>{stateLabels[i]}</span>
              <input
                value={value}
                aria-label={`x0 ${stateLabels[i]}`}
                onChange={(e) => setX0(x0.map((v, j) => (j === i ? e.target.value : v)))}
                inputMode="decimal"
                className={`w-24 text-right ${INPUT_CLASSES}`}
              />
            </label>
          ))}
        </fieldset>
        <label className="flex flex-col gap-1">
          <span className="font-medium">Samples to show</span>
          <input
            value={steps}
            onChange={(e) => setSteps(e.target.value)}
            inputMode="numeric"
            className={`w-24 ${INPUT_CLASSES}`}
          />
        </label>
        <Button type="submit" variant="primary">
          Show
        </Button>
      </form>
      {problem ? (
        <p role="alert" className="text-sm font-medium text-diverged">
          {problem}
        </p>
      ) : null}
      {explored.isError ? <ErrorNotice error={explored.error} onRetry={() => void explored.refetch()} /> : null}
      {result ? (
        <>
          <div className="flex flex-wrap gap-6">
            <MatrixTable
              title={`A^k for k = ${body.k} (${formatDuration(body.k * samplePeriodS)} ahead)`}
              matrix={result.Ak}
              rowLabels={stateLabels}
              columnLabels={stateLabels}
            />
            {xk ? (
              <MatrixTable
                title={`x(${body.k}) = A^k x0`}
                matrix={xk.map((v) => [v])}
                rowLabels={stateLabels}
                columnLabels={['value']}
              />
            ) : (
              <p className="text-sm">
                x({body.k}) lies beyond the {body.steps} samples shown; it is A^k times x0 = (
                {x0.map((v) => formatNumber(Number(v))).join(', ')}).
              </p>
            )}
          </div>
          <FreeResponseCharts
            trajectory={result.trajectory}
            modal={result.modal}
            modalError={result.modalError}
            stateLabels={stateLabels}
            samplePeriodS={samplePeriodS}
          />
          {n === 2 ? (
            <PhasePlane
              trajectory={result.trajectory}
              directions={eigenDirections(version.A, version.analysis.modes, result.modal)}
              xLabel={stateLabels[0]}
              yLabel={stateLabels[1]}
            />
          ) : null}
        </>
      ) : explored.isPending ? (
        <p role="status" className="text-sm text-ink/70">
          Working out A^k and the free response…
        </p>
      ) : null}
    </div>
  );
}
