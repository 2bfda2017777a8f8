import type { Loop } from '../../../loops/api/get-loops';
import type { Version } from '../../types';
import { GRID_TITLES, gridLabels } from '../../utils/signal-labels';
import { buildVerdict } from '../../utils/verdict';
import { EigenvaluePlane } from '../analysis/eigenvalue-plane';
import { VerdictBanner } from '../verdict-banner';
import { MatrixComparison } from './matrix-comparison';
import { StepOverlay } from './step-overlay';
import { PageSection } from '../../../../components/ui/page-section';

/** Two versions of one loop side by side: verdicts, matrices cell by cell, eigenvalues, step responses. */
export function CompareView({ version, other, loop }: { version: Version; other: Version; loop: Loop }) {
  const labels = gridLabels(loop);
  const mine = `version ${version.number}`;
  const theirs = `version ${other.number}`;
  const matrices = (['A', 'B', 'C', 'D'] as const).map((name) => (
    <MatrixComparison
      key={name}
      name={name}
      title={GRID_TITLES[name]}
      before={other[name]}
      after={version[name]}
      beforeLabel={theirs}
      afterLabel={mine}
      rowLabels={labels[name].rows}
      columnLabels={labels[name].columns}
    />
  ));
  return (
    <div className="space-y-6">
      <PageSection title="Verdicts">
        <div className="grid gap-3 lg:grid-cols-2">
          {[version, other].map((v) => (
            <div key={v.id} className="space-y-1">
              <h3 className="text-sm font-bold">Version {v.number}</h3>
              <VerdictBanner compact verdict={buildVerdict(v.analysis, loop.samplePeriodS)} />
            </div>
          ))}
        </div>
      </PageSection>
      <PageSection title="Matrices">
        <p className="text-sm text-ink/75">
          Cells of {mine} that differ from {theirs} are outlined and say what they were and by how much they changed.
        </p>
        {matrices}
      </PageSection>
      <PageSection title="Eigenvalues">
        <EigenvaluePlane
          sets={[
            { label: mine, modes: version.analysis.modes },
            { label: theirs, modes: other.analysis.modes, hollow: true },
          ]}
          samplePeriodS={loop.samplePeriodS}
        />
      </PageSection>
      <PageSection title="Step responses">
        <StepOverlay version={version} other={other} loop={loop} />
      </PageSection>
    </div>
  );
}
