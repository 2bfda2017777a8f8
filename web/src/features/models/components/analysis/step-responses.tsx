import { useState } from 'react';
import { seriesColour } from '../../../../components/charts/chart-theme';
import { ErrorNotice } from '../../../../components/errors/error-notice';
import type { Loop } from '../../../loops/api/get-loops';
import { useStepAnalysis } from '../../hooks/use-step-analysis';
import type { Version } from '../../types';
import { suggestedStepHorizon } from '../../utils/horizon-defaults';
import { outputSteadyStateGain } from '../../utils/step-metrics';
import { gainUnit, stepSummary } from '../../utils/step-summary';
import { HorizonSelect } from './horizon-select';
import { InputSelect } from './input-select';
import { StepResponseChart } from './step-response-chart';

/** Output step responses for a unit step in one input, over a horizon the engineer picks. */
export function StepResponses({ version, loop }: { version: Version; loop: Loop }) {
  const [horizon, setHorizon] = useState(() => suggestedStepHorizon(version.analysis, loop.samplePeriodS));
  const [input, setInput] = useState(0);
  const { analysis, isFetching, error, refetch } = useStepAnalysis(version, horizon);
  const gains = outputSteadyStateGain(version.analysis.steadyStateGain, version.C, version.D);
  const outputs = version.C ? loop.outputs : loop.states;
  const inp = loop.inputs[input] ?? { name: `input ${input + 1}`, unit: '' };

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-4 text-sm">
        <HorizonSelect value={horizon} samplePeriodS={loop.samplePeriodS} onChange={setHorizon} />
        <InputSelect inputs={loop.inputs} value={input} onChange={setInput} />
        {isFetching ? <span role="status">Working out the response over {horizon} samples…</span> : null}
      </div>
      {error ? <ErrorNotice error={error} onRetry={() => void refetch()} /> : null}
      <div className="grid gap-3 lg:grid-cols-2">
        {analysis.stepResponse.series.map((perInput, i) => {
          const out = outputs[i] ?? { name: `output ${i + 1}`, unit: '' };
          const values = perInput[input];
          return (
            <StepResponseChart
              key={`${i}-${input}`}
              title={`${inp.name} → ${out.name}`}
              yLabel={out.unit ? `${out.name} (${out.unit})` : out.name}
              t={analysis.stepResponse.t}
              lines={[{ label: `${out.name} after a unit step`, colour: seriesColour(0), values }]}
              summary={stepSummary(
                values,
                analysis.stepResponse.t,
                gains?.[i]?.[input] ?? null,
                gainUnit(out.unit, inp.unit),
              )}
            />
          );
        })}
      </div>
    </div>
  );
}
