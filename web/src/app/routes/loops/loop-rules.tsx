import { useQuery } from '@tanstack/react-query';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { PageLoading } from '../../../components/ui/page-loading';
import { driftRulesQueryOptions } from '../../../features/drift-rules/api/get-drift-rules';
import { RuleCard } from '../../../features/drift-rules/components/rule-card';
import { RULE_KINDS } from '../../../features/drift-rules/utils/rule-words';
import { hasRole } from '../../../features/session/roles';
import { useSignedInUser } from '../../../features/session/use-signed-in-user';
import { useLoopOfPage } from './loop-layout';

export function LoopRulesTab() {
  const loop = useLoopOfPage();
  const user = useSignedInUser();
  const rules = useQuery(driftRulesQueryOptions(loop.id));
  const mayEdit = hasRole(user, 'engineer');

  if (rules.isError) return <ErrorNotice error={rules.error} onRetry={() => void rules.refetch()} />;
  if (!rules.data) return <PageLoading />;
  return (
    <div className="space-y-4">
      <p className="max-w-4xl text-sm">
        Drift rules watch the residuals of {loop.tag} at its sample period of {loop.samplePeriodS} s. Each says how
        often it would raise a false alert while the plant matches the model.
        {mayEdit ? ' Every save is a new version with your note.' : ' Control engineers change them.'}
      </p>
      {loop.activeVersionId === null ? (
        <p className="text-sm font-medium">
          {loop.tag} has no active model version yet: its rules raise nothing until a twin runs.
        </p>
      ) : null}
      {RULE_KINDS.map((kind) => (
        <RuleCard key={kind} loop={loop} kind={kind} rule={rules.data.find((r) => r.kind === kind)} mayEdit={mayEdit} />
      ))}
    </div>
  );
}
