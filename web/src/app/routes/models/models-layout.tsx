import { Outlet } from 'react-router';
import { RouteTabs } from '../../../components/ui/route-tabs';

const MODELS_PAGES = [
  { to: '/models', label: 'Registry', end: true },
  { to: '/models/audit', label: 'Audit log' },
] as const;

/** The section's own pages; a loop's versions and a version's analysis sit under the registry. */
export function ModelsLayout() {
  return (
    <div className="space-y-4">
      <RouteTabs label="Models" tabs={MODELS_PAGES} />
      <Outlet />
    </div>
  );
}
