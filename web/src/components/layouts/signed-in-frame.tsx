import type { ReactNode } from 'react';
import { Outlet } from 'react-router';
import { WaitingAlertsBanner } from '../../features/alerts/components/waiting-alerts-banner';
import { useAlertUpdates } from '../../features/alerts/hooks/use-alert-updates';
import { hasRole } from '../../features/session/roles';
import { useSignedInUser } from '../../features/session/use-signed-in-user';
import { FooterCaution } from './footer-caution';
import { MainNav } from './main-nav';
import { TopStrip } from './top-strip';

export function FrameGrid({ top, nav, children }: { top: ReactNode; nav: ReactNode; children: ReactNode }) {
  return (
    <div className="grid min-h-screen grid-cols-[3.25rem_1fr] grid-rows-[auto_1fr_auto] bg-paper text-ink md:grid-cols-[11rem_1fr]">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:z-50 focus:bg-panel focus:p-2">
        Skip to the page
      </a>
      {top}
      {nav}
      <main id="main" className="min-w-0 px-5 py-4">
        {children}
      </main>
      <FooterCaution />
    </div>
  );
}

export function SignedInFrame() {
  const user = useSignedInUser();
  useAlertUpdates();
  const top = (
    <div className="col-span-2">
      <TopStrip user={user} />
      {hasRole(user, 'oncall') ? <WaitingAlertsBanner /> : null}
    </div>
  );
  return (
    <FrameGrid top={top} nav={<MainNav user={user} />}>
      <Outlet />
    </FrameGrid>
  );
}
