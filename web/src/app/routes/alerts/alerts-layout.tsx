import { Outlet } from 'react-router';
import { PageHeader } from '../../../components/ui/page-header';
import { RouteTabs } from '../../../components/ui/route-tabs';

const TABS = [
  { to: '/alerts', label: 'Queue', end: true },
  { to: '/alerts/load', label: 'Alert load' },
];

export function AlertsLayout() {
  return (
    <div className="space-y-4">
      <PageHeader
        title="Alerts"
        description="Divergence alerts, raised when a loop stops behaving like its model: who should act, and how the alert load stands."
      />
      <RouteTabs label="Alert pages" tabs={TABS} />
      <Outlet />
    </div>
  );
}
