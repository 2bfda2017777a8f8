import { Link } from 'react-router';
import { PLANT_NAME, PRODUCT_NAME } from '../../config/product';
import { HealthDot } from '../../features/health/components/health-dot';
import type { SignedInUser } from '../../features/session/roles';
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
        <Link to="/rota" className="text-sm hover:underline">
          On call now: — <span className="text-ink/70">(nobody is on the rota yet)</span>
        </Link>
        <HealthDot />
        <UserMenu user={user} />
      </div>
    </header>
  );
}
