import type { Loop } from '../../../loops/api/get-loops';
import type { Version } from '../../types';
import { GRID_TITLES, gridLabels } from '../../utils/signal-labels';
import { CORRECTION_WORDS } from '../correction-words';
import { MatrixTable } from './matrix-table';

/** The stored matrices: the continuous model when it was given, the sampled one, and the correction. */
export function VersionMatrices({ version, loop }: { version: Version; loop: Loop }) {
  const labels = gridLabels(loop);
  const states = labels.A.rows;
  const outputs = version.C ? labels.C.rows : states;
  const correction = CORRECTION_WORDS[version.correction.mode];
  const { K, Q, R } = version.correction;
  return (
    <div className="space-y-4">
      {version.continuous ? (
        <div className="space-y-2">
          <h3 className="font-bold">Continuous model as entered</h3>
          <div className="flex flex-wrap gap-4">
            <MatrixTable
              title={GRID_TITLES.Ac}
              matrix={version.continuous.Ac}
              rowLabels={states}
              columnLabels={states}
            />
            <MatrixTable
              title={GRID_TITLES.Bc}
              matrix={version.continuous.Bc}
              rowLabels={states}
              columnLabels={labels.B.columns}
            />
          </div>
          <h3 className="font-bold">Sampled every {version.continuous.samplePeriodS} s with a zero-order hold</h3>
        </div>
      ) : null}
      <div className="flex flex-wrap gap-4">
        <MatrixTable title={GRID_TITLES.A} matrix={version.A} rowLabels={states} columnLabels={states} />
        <MatrixTable title={GRID_TITLES.B} matrix={version.B} rowLabels={states} columnLabels={labels.B.columns} />
        {version.C ? (
          <MatrixTable title={GRID_TITLES.C} matrix={version.C} rowLabels={labels.C.rows} columnLabels={states} />
        ) : null}
        {version.D ? (
          <MatrixTable
            title={GRID_TITLES.D}
            matrix={version.D}
            rowLabels={labels.D.rows}
            columnLabels={labels.D.columns}
          />
        ) : null}
      </div>
      {version.C ? null : (
        <p className="text-sm text-ink/75">
          No C given: output i is state i.{' '}
          {version.D ? '' : 'No D given: the inputs have no direct effect on the outputs.'}
        </p>
      )}
      <div className="space-y-2 text-sm">
        <h3 className="font-bold">Correction: {correction.name}</h3>
        <p className="max-w-3xl">{correction.explanation}</p>
        {version.correction.mode === 'kalman' ? (
          <div className="flex flex-wrap gap-4">
            {K ? (
              <MatrixTable
                title="K — steady-state Kalman gain (state change per unit of output error)"
                matrix={K}
                rowLabels={states}
                columnLabels={outputs}
              />
            ) : (
              <p>The gain K was not stored.</p>
            )}
            {Q ? <MatrixTable title={GRID_TITLES.Q} matrix={Q} rowLabels={states} columnLabels={states} /> : null}
            {R ? <MatrixTable title={GRID_TITLES.R} matrix={R} rowLabels={outputs} columnLabels={outputs} /> : null}
          </div>
        ) : null}
      </div>
    </div>
  );
}
