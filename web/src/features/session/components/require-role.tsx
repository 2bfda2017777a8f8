import { Outlet } from 'react-router';
import { ForbiddenPage } from '../../../components/errors/forbidden-page';
import { hasRole, type Role } from '../roles';
import { useSignedInUser } from '../use-signed-in-user';

export function RequireRole({ role }: { role: Role | undefined }) {
  const user = useSignedInUser();
  if (role && !hasRole(user, role)) return <ForbiddenPage requiredRole={role} userRoles={user.roles} />;
  return <Outlet />;
}
