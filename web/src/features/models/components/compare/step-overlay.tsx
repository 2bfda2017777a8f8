import { useState } from 'react';
import { seriesColour } from '../../../../components/charts/chart-theme';
import type { Loop } from '../../../loops/api/get-loops';
import { useStepAnalysis } from '../../hooks/use-step-analysis';
import type { Version } from '../../types';
import { suggestedStepHorizon } from '../../utils/horizon-defaults';
import { outputSteadyStateGain } from '../../utils/step-metrics';
import { gainUnit, stepSummary } from '../../utils/step-summary';
import { HorizonSelect } from '../analysis/horizon-select';
import { InputSelect } from '../analysis/input-select';
import { StepResponseChart } from '../analysis/step-response-chart';

type StepOverlayProps = { version: Version; other: Version; loop: Loop };

/** Both versions' step responses on one chart per output: this one solid, the other dashed. */
export function StepOverlay({ version, other, loop }: StepOverlayProps) {
  const [horizon, setHorizon] = useState(() =>
    Math.max(
      suggestedStepHorizon(version.analysis, loop.samplePeriodS),
      suggestedStepHorizon(other.analysis, loop.samplePeriodS),
    ),
  );
  const [input, setInput] = useState(0);
  const mine = useStepAnalysis(version, horizon).analysis;
  const theirs = useStepAnalysis(other, horizon).analysis;
  const samples = Math.min(mine.stepResponse.t.length, theirs.stepResponse.t.length);
  const t = mine.stepResponse.t.slice(0, samples);
  const gains = outputSteadyStateGain(version.analysis.steadyStateGain, version.C, version.D);
  const otherGains = outputSteadyStateGain(other.analysis.steadyStateGain, other.C, other.D);
  const outputs = version.C ? loop.outputs : loop.states;
  const inp = loop.inputs[input] ?? { name: `input ${input + 1}`, unit: '' };
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-4">
        <HorizonSelect value={horizon} samplePeriodS={loop.samplePeriodS} onChange={setHorizon} />
        <InputSelect inputs={loop.inputs} value={input} onChange={setInput} />
      </div>
      <div className="grid gap-3 lg:grid-cols-2">
        {mine.stepResponse.series.map((perInput, i) => {
          const out = outputs[i] ?? { name: `output ${i + 1}`, unit: '' };
          const ours = perInput[input].slice(0, samples);
          const others = (theirs.stepResponse.series[i]?.[input] ?? []).slice(0, samples);
          const unit = gainUnit(out.unit, inp.unit);
          return (
            <StepResponseChart
              key={`${i}-${input}`}
              title={`${inp.name} → ${out.name}`}
              yLabel={out.unit ? `${out.name} (${out.unit})` : out.name}
              t={t}
              lines={[
                { label: `version ${version.number}`, colour: seriesColour(0), values: ours },
                { label: `version ${other.number}`, colour: seriesColour(1), dash: [6, 4], values: others },
              ]}
              summary={`Version ${version.number}: ${stepSummary(ours, t, gains?.[i]?.[input] ?? null, unit)} Version ${other.number}: ${stepSummary(others, t, otherGains?.[i]?.[input] ?? null, unit)}`}
            />
          );
        })}
      </div>
    </div>
  );
}
