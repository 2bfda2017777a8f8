import type { RouteObject } from 'react-router';
import { PageLoading } from '../../../components/ui/page-loading';
import { AlertsLayout } from './alerts-layout';

/** The alert pages load when first opened; the detail and the load report carry charts. */
const queuePage = async () => ({ Component: (await import('./alerts-queue')).AlertsQueuePage });
const loadPage = async () => ({ Component: (await import('./alert-load')).AlertLoadPage });
const detailPage = async () => ({ Component: (await import('./alert-detail')).AlertDetailPage });

export function alertRoutes(): RouteObject[] {
  return [
    {
      element: <AlertsLayout />,
      children: [
        { index: true, HydrateFallback: PageLoading, lazy: queuePage },
        { path: 'load', HydrateFallback: PageLoading, lazy: loadPage },
      ],
    },
    { path: ':alertId', HydrateFallback: PageLoading, lazy: detailPage },
  ];
}
