import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageLoading } from '../../../components/ui/page-loading';
import { formatInTimeZone } from '../../../lib/format-time';
import { modelVersionQueryOptions } from '../api/get-model-version';
import { buildVerdict } from '../utils/verdict';
import { CORRECTION_WORDS } from './correction-words';
import { VerdictBanner } from './verdict-banner';

type LoopLike = { tag: string; activeVersionId: string | null; samplePeriodS: number; timeZone: string };

function person(value: { name: string; email: string } | null): string {
  return value ? value.name || value.email : 'someone no longer listed';
}

/** What an operator needs to know about the model the loop's twin runs. */
export function ActiveVersionSummary({ loop, showAnalysisLink }: { loop: LoopLike; showAnalysisLink: boolean }) {
  const versionId = loop.activeVersionId;
  const version = useQuery({ ...modelVersionQueryOptions(versionId ?? ''), enabled: versionId !== null });

  if (versionId === null) {
    return (
      <EmptyState title="No twin model is active">
        <p>
          The twin of {loop.tag} starts once a control engineer adds a model version, a second engineer approves it, and
          it is activated. The active version will be summarised here: who approved it and when, what changed, and how
          the model behaves.
        </p>
      </EmptyState>
    );
  }
  if (version.isError) return <ErrorNotice error={version.error} onRetry={() => void version.refetch()} />;
  if (!version.data) return <PageLoading />;
  const v = version.data;
  const correction = CORRECTION_WORDS[v.correction.mode];
  const when = (iso: string | null) => formatInTimeZone(iso, loop.timeZone);
  return (
    <section aria-label="Active model version" className="space-y-3">
      <h2 className="text-lg font-bold">Version {v.number} is the twin&apos;s model</h2>
      <VerdictBanner verdict={buildVerdict(v.analysis, loop.samplePeriodS)} />
      <dl className="grid max-w-3xl grid-cols-[12rem_1fr] gap-x-4 gap-y-1.5 rounded-sm border border-rule bg-panel px-4 py-3 text-sm">
        <dt className="font-medium">Written by</dt>
        <dd>{`${person(v.author)}, ${when(v.createdAt)}`}</dd>
        <dt className="font-medium">Approved by</dt>
        <dd>{v.reviewer ? `${person(v.reviewer)}, ${when(v.reviewedAt)}` : 'not recorded'}</dd>
        <dt className="font-medium">Active since</dt>
        <dd>{v.activatedBy ? `${when(v.activatedAt)}, activated by ${person(v.activatedBy)}` : when(v.activatedAt)}</dd>
        <dt className="font-medium">What changed</dt>
        <dd className="whitespace-pre-line">{v.changeNote}</dd>
        <dt className="font-medium">Correction in use</dt>
        <dd>
          <strong>{correction.name}.</strong> {correction.explanation}
        </dd>
      </dl>
      {showAnalysisLink ? (
        <p className="text-sm">
          <Link to={`/models/versions/${v.id}`} className="font-medium underline">
            Open the full analysis of version {v.number}
          </Link>
        </p>
      ) : null}
    </section>
  );
}
