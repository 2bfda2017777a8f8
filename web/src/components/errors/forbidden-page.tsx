import { Link } from 'react-router';
import { describeRoles, ROLE_LABELS, type Role } from '../../features/session/roles';
import { PageHeader } from '../ui/page-header';

type ForbiddenPageProps = {
  requiredRole: Role;
  userRoles: readonly Role[];
};

export function ForbiddenPage({ requiredRole, userRoles }: ForbiddenPageProps) {
  return (
    <div>
      <PageHeader title="Not available for your role" />
      <div className="max-w-2xl space-y-2 text-sm">
        <p>
          This page needs the <strong>{ROLE_LABELS[requiredRole]}</strong> role (<code>{requiredRole}</code>). Your
          roles: {describeRoles(userRoles)}.
        </p>
        <p>If your work needs it, ask a Shadowloop administrator to add the role to your account.</p>
        <p>
          <Link className="font-medium underline" to="/">
            Go to the floor
          </Link>
        </p>
      </div>
    </div>
  );
}
