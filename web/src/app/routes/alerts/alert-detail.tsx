import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { CautionBlock } from '../../../components/ui/caution-block';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/page-loading';
import { alertQueryOptions } from '../../../features/alerts/api/get-alert';
import { AckLinkBanner } from '../../../features/alerts/components/ack-link-banner';
import { AlertActions } from '../../../features/alerts/components/alert-actions';
import { AlertFacts } from '../../../features/alerts/components/alert-facts';
import { AlertSnapshot } from '../../../features/alerts/components/alert-snapshot';
import { AlertStateWord } from '../../../features/alerts/components/alert-state-word';
import { AlertTimeline } from '../../../features/alerts/components/alert-timeline';
import { PriorityBadge } from '../../../features/alerts/components/priority-badge';
import { ResidualDirection } from '../../../features/alerts/components/residual-direction';
import { ValuesAtRaise } from '../../../features/alerts/components/values-at-raise';
import { alertTitle } from '../../../features/alerts/utils/alert-words';
import { loopQueryOptions } from '../../../features/loops/api/get-loop';
import { hasRole } from '../../../features/session/roles';
import { useSignedInUser } from '../../../features/session/use-signed-in-user';
import { useNow } from '../../../lib/use-now';
import { PageSection } from '../../../components/ui/page-section';

export function AlertDetailPage() {
  const alertId = useParams().alertId ?? '';
  const user = useSignedInUser();
  const nowMs = useNow(30_000);
  const alert = useQuery(alertQueryOptions(alertId));
  const loop = useQuery({ ...loopQueryOptions(alert.data?.loopId ?? ''), enabled: Boolean(alert.data) });
  const failed = alert.error ?? loop.error;

  if (failed) {
    return (
      <div>
        <PageHeader title="Alert" />
        <AckLinkBanner />
        <ErrorNotice error={failed} onRetry={() => void Promise.all([alert.refetch(), loop.refetch()])} />
      </div>
    );
  }
  if (!alert.data || !loop.data) return <PageLoading />;
  const a = alert.data;
  const timeZone = loop.data.timeZone;
  return (
    <div className="space-y-6">
      <PageHeader
        title={alertTitle(a)}
        description={
          <span className="flex flex-wrap items-center gap-3">
            <PriorityBadge priority={a.priority} />
            <AlertStateWord state={a.state} />
            <Link to="/alerts" className="underline">
              Every alert
            </Link>
          </span>
        }
      />
      <AckLinkBanner />
      <p className="max-w-4xl text-lg font-medium">{a.summary}</p>
      <AlertActions alert={a} mayAct={hasRole(user, 'oncall')} timeZone={timeZone} />
      <AlertFacts alert={a} timeZone={timeZone} nowMs={nowMs} />
      <PageSection title="Where the residual points">
        <ResidualDirection direction={a.direction} />
      </PageSection>
      <PageSection title="Values at the raise">
        <ValuesAtRaise detail={a.detail} timeZone={timeZone} />
      </PageSection>
      <PageSection title="Around the raise">
        <AlertSnapshot alert={a} loop={loop.data} />
      </PageSection>
      <PageSection title="Timeline">
        <AlertTimeline events={a.events} timeZone={timeZone} />
      </PageSection>
      <CautionBlock />
    </div>
  );
}
