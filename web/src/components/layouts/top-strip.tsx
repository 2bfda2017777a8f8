import { Link } from 'react-router';
import { PLANT_NAME, PRODUCT_NAME } from '../../config/product';
import { WaitingCountLink } from '../../features/alerts/components/waiting-count-link';
import { HealthDot } from '../../features/health/components/health-dot';
import { OnCallNowLink } from '../../features/rota/components/on-call-now-link';
import { hasRole, type SignedInUser } from '../../features/session/roles';
import { ShadowloopMark } from '../ui/shadowloop-mark';
import { UserMenu } from './user-menu';

export function TopStrip({ user }: { user: SignedInUser }) {
  return (
    <header className="col-span-2 flex flex-wrap items-center gap-x-4 gap-y-1 border-b border-rule border-t-4 border-t-twin bg-panel px-4 py-1.5">
      <Link to="/" className="flex items-center gap-2 font-bold tracking-tight">
        <ShadowloopMark size={26} />
        <span className="text-lg">{PRODUCT_NAME}</span>
      </Link>
      <span className="border-l border-rule pl-4 text-sm font-medium">{PLANT_NAME}</span>
      <div className="ml-auto flex items-center gap-3">
        <OnCallNowLink />
        {hasRole(user, 'oncall') ? <WaitingCountLink /> : null}
        <HealthDot />
        <UserMenu user={user} />
      </div>
    </header>
  );
}
