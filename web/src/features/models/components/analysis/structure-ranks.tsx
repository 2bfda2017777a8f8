import type { ModelAnalysis } from '../../types';

type StructureRanksProps = { analysis: ModelAnalysis; states: number };

/** Controllability and observability, with what a shortfall means for the twin in plain words. */
export function StructureRanks({ analysis, states }: StructureRanksProps) {
  const controllable = analysis.controllabilityRank >= states;
  const observable = analysis.observabilityRank >= states;
  return (
    <dl className="grid max-w-3xl gap-3 text-sm">
      <div>
        <dt className="font-bold">
          Controllability rank {analysis.controllabilityRank} of {states} —{' '}
          {controllable ? 'every state can be moved by the inputs' : 'not every state can be moved'}
        </dt>
        {controllable ? null : (
          <dd className="mt-1">
            {states - analysis.controllabilityRank} direction{states - analysis.controllabilityRank === 1 ? '' : 's'} of
            the state cannot be reached from any input: the inputs never excite that part, and it only moves by its own
            modes. Check B for a missing entry, or whether the model has more states than the inputs can drive.
          </dd>
        )}
      </div>
      <div>
        <dt className="font-bold">
          Observability rank {analysis.observabilityRank} of {states} —{' '}
          {observable ? 'every state shows in the outputs' : 'not every state shows in the outputs'}
        </dt>
        {observable ? null : (
          <dd className="mt-1">
            {states - analysis.observabilityRank} direction{states - analysis.observabilityRank === 1 ? '' : 's'} of the
            state never show in the measured outputs, so no measurement can correct the twin there: with a reset or
            Kalman correction that part still only fades as fast as its own modes. Check C, or whether those states are
            needed.
          </dd>
        )}
      </div>
    </dl>
  );
}
