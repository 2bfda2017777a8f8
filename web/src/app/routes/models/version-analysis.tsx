import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/page-loading';
import { VersionEvidence } from '../../../features/backtests/components/version-evidence';
import { loopQueryOptions } from '../../../features/loops/api/get-loop';
import { modelVersionQueryOptions } from '../../../features/models/api/get-model-version';
import { EigenvaluePlane } from '../../../features/models/components/analysis/eigenvalue-plane';
import { ModesTable } from '../../../features/models/components/analysis/modes-table';
import { StepResponses } from '../../../features/models/components/analysis/step-responses';
import { StructureRanks } from '../../../features/models/components/analysis/structure-ranks';
import { TransitionExplorer } from '../../../features/models/components/analysis/transition-explorer';
import { VersionFacts } from '../../../features/models/components/analysis/version-facts';
import { VersionMatrices } from '../../../features/models/components/analysis/version-matrices';
import { VersionActionBar } from '../../../features/models/components/review/version-action-bar';
import { VerdictBanner } from '../../../features/models/components/verdict-banner';
import { VersionStatusWord } from '../../../features/models/components/version-status-word';
import { buildVerdict } from '../../../features/models/utils/verdict';
import { signalLabel } from '../../../features/models/utils/signal-labels';
import { useSignedInUser } from '../../../features/session/use-signed-in-user';
import { PageSection } from '../../../components/ui/page-section';

export function VersionAnalysisPage() {
  const versionId = useParams().versionId ?? '';
  const user = useSignedInUser();
  const version = useQuery(modelVersionQueryOptions(versionId));
  const loop = useQuery({ ...loopQueryOptions(version.data?.loopId ?? ''), enabled: Boolean(version.data) });
  const failed = version.error ?? loop.error;

  if (failed) {
    return (
      <div>
        <PageHeader title="Model version" />
        <ErrorNotice error={failed} onRetry={() => void Promise.all([version.refetch(), loop.refetch()])} />
      </div>
    );
  }
  if (!version.data || !loop.data) return <PageLoading />;
  const v = version.data;
  const l = loop.data;
  const states = l.states.map(signalLabel);
  return (
    <div className="space-y-6">
      <PageHeader
        title={`${l.tag} · version ${v.number}`}
        description={
          <span className="flex flex-wrap items-center gap-3">
            <VersionStatusWord status={v.status} />
            <span>{l.name}</span>
            <Link to={`/models/${l.id}`} className="underline">
              All versions of {l.tag}
            </Link>
          </span>
        }
      />
      <VerdictBanner verdict={buildVerdict(v.analysis, l.samplePeriodS)} />
      <VersionActionBar version={v} user={user} loop={l} />
      <VersionFacts version={v} timeZone={l.timeZone} />
      <PageSection title="Evidence">
        <VersionEvidence version={v} loopId={l.id} timeZone={l.timeZone} />
      </PageSection>
      <PageSection title="Modes">
        <div className="grid items-start gap-4 xl:grid-cols-[20rem_1fr]">
          <EigenvaluePlane
            sets={[{ label: `version ${v.number}`, modes: v.analysis.modes }]}
            samplePeriodS={l.samplePeriodS}
          />
          <ModesTable modes={v.analysis.modes} samplePeriodS={l.samplePeriodS} />
        </div>
      </PageSection>
      <PageSection title="Step responses">
        <StepResponses version={v} loop={l} />
      </PageSection>
      <PageSection title="State transition explorer">
        <TransitionExplorer version={v} stateLabels={states} samplePeriodS={l.samplePeriodS} />
      </PageSection>
      <PageSection title="Controllability and observability">
        <StructureRanks analysis={v.analysis} states={l.states.length} />
      </PageSection>
      <PageSection title="Matrices">
        <VersionMatrices version={v} loop={l} />
      </PageSection>
    </div>
  );
}
