import type { QueryClient } from '@tanstack/react-query';
import type { RouteObject } from 'react-router';
import { NotFoundPage } from '../components/errors/not-found-page';
import { RootRouteError, RouteError } from '../components/errors/route-error';
import { FrameSkeleton } from '../components/layouts/frame-skeleton';
import { SignedInFrame } from '../components/layouts/signed-in-frame';
import { PageLoading } from '../components/ui/page-loading';
import { sectionRole } from '../config/sections';
import { accessTokensQueryOptions } from '../features/access-tokens/api/get-access-tokens';
import { backtestQueryOptions } from '../features/backtests/api/get-backtest';
import { RequireRole } from '../features/session/components/require-role';
import { signedInUserLoader, warmCacheLoader } from './loaders';
import { adminRoutes } from './routes/admin/admin-routes';
import { AboutPage } from './routes/about';
import { alertRoutes } from './routes/alerts/alerts-routes';
import { FloorPage } from './routes/floor';
import { loopRoutes } from './routes/loops/loop-routes';
import { modelRoutes } from './routes/models/models-routes';
import { SignInPage } from './routes/signin';
import { MyAccessTokensPage } from './routes/tokens';

const rotaPage = async () => ({ Component: (await import('./routes/rota/rota-page')).RotaPage });
const backtestPage = async () => ({
  Component: (await import('./routes/backtests/backtest-page')).BacktestPage,
});

export function createAppRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      id: 'root',
      errorElement: <RootRouteError />,
      children: [
        { path: '/signin', element: <SignInPage /> },
        {
          id: 'frame',
          loader: signedInUserLoader(queryClient),
          HydrateFallback: FrameSkeleton,
          element: <SignedInFrame />,
          children: [
            {
              errorElement: <RouteError />,
              children: [
                { index: true, element: <FloorPage /> },
                { path: 'loops', children: loopRoutes(queryClient) },
                {
                  path: 'models',
                  element: <RequireRole role={sectionRole('models')} />,
                  children: modelRoutes(queryClient),
                },
                { path: 'alerts', children: alertRoutes() },
                { path: 'rota', HydrateFallback: PageLoading, lazy: rotaPage },
                {
                  path: 'backtests/:backtestId',
                  loader: warmCacheLoader(queryClient, ({ params }) => backtestQueryOptions(params.backtestId ?? '')),
                  HydrateFallback: PageLoading,
                  lazy: backtestPage,
                },
                { path: 'about', element: <AboutPage /> },
                {
                  path: 'tokens',
                  loader: warmCacheLoader(queryClient, () => accessTokensQueryOptions('mine')),
                  HydrateFallback: PageLoading,
                  element: <MyAccessTokensPage />,
                },
                {
                  path: 'admin',
                  element: <RequireRole role={sectionRole('admin')} />,
                  children: adminRoutes(queryClient),
                },
                { path: '*', element: <NotFoundPage /> },
              ],
            },
          ],
        },
      ],
    },
  ];
}
