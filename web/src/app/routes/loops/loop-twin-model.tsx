import { ActiveVersionSummary } from '../../../features/models/components/active-version-summary';
import { hasRole } from '../../../features/session/roles';
import { useSignedInUser } from '../../../features/session/use-signed-in-user';
import { useLoopOfPage } from './loop-layout';

export function LoopTwinModelTab() {
  const loop = useLoopOfPage();
  const user = useSignedInUser();
  return <ActiveVersionSummary loop={loop} showAnalysisLink={hasRole(user, 'engineer')} />;
}
