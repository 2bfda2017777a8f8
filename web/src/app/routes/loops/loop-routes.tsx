import type { QueryClient } from '@tanstack/react-query';
import type { RouteObject } from 'react-router';
import { PageLoading } from '../../../components/ui/page-loading';
import { loopQueryOptions } from '../../../features/loops/api/get-loop';
import { loopsQueryOptions } from '../../../features/loops/api/get-loops';
import { RequireRole } from '../../../features/session/components/require-role';
import { warmCacheLoader } from '../../loaders';
import { EditLoopPage } from './edit-loop';
import { ImportReadingsPage } from './import-readings';
import { LoopLayout } from './loop-layout';
import { LoopLogTab } from './loop-log';
import { LoopTrendTab } from './loop-trend';
import { LoopTwinModelTab } from './loop-twin-model';
import { LoopsPage } from './loops-page';
import { RegisterLoopPage } from './register-loop';

/** The alert, rule and backtest tabs (forms, tables) load when first opened. */
const alertsTab = async () => ({ Component: (await import('./loop-alerts')).LoopAlertsTab });
const rulesTab = async () => ({ Component: (await import('./loop-rules')).LoopRulesTab });
const backtestsTab = async () => ({ Component: (await import('./loop-backtests')).LoopBacktestsTab });

export function loopRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      index: true,
      loader: warmCacheLoader(queryClient, () => loopsQueryOptions()),
      HydrateFallback: PageLoading,
      element: <LoopsPage />,
    },
    {
      path: 'new',
      element: <RequireRole role="engineer" />,
      children: [{ index: true, element: <RegisterLoopPage /> }],
    },
    {
      path: ':loopId/import',
      element: <RequireRole role="engineer" />,
      children: [{ index: true, element: <ImportReadingsPage /> }],
    },
    {
      path: ':loopId/edit',
      element: <RequireRole role="engineer" />,
      children: [{ index: true, element: <EditLoopPage /> }],
    },
    {
      path: ':loopId',
      loader: warmCacheLoader(queryClient, ({ params }) => loopQueryOptions(params.loopId ?? '')),
      HydrateFallback: PageLoading,
      element: <LoopLayout />,
      children: [
        { index: true, element: <LoopTrendTab /> },
        { path: 'model', element: <LoopTwinModelTab /> },
        { path: 'alerts', HydrateFallback: PageLoading, lazy: alertsTab },
        { path: 'rules', HydrateFallback: PageLoading, lazy: rulesTab },
        { path: 'backtests', HydrateFallback: PageLoading, lazy: backtestsTab },
        { path: 'log', element: <LoopLogTab /> },
      ],
    },
  ];
}
