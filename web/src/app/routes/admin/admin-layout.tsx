import { Outlet } from 'react-router';
import { RouteTabs } from '../../../components/ui/route-tabs';

const ADMIN_PAGES = [
  { to: '/admin/users', label: 'Users and roles' },
  { to: '/admin/ingest-sources', label: 'Ingest sources' },
  { to: '/admin/access-tokens', label: 'Access tokens' },
  { to: '/admin/dev-mail', label: 'Development mailbox' },
  { to: '/admin/audit', label: 'Audit log' },
  { to: '/admin/api', label: 'API' },
] as const;

export function AdminLayout() {
  return (
    <div className="space-y-4">
      <RouteTabs label="Admin" tabs={ADMIN_PAGES} />
      <Outlet />
    </div>
  );
}
