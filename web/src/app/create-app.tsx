import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, type RouteObject } from 'react-router';
import { createQueryClient, type QueryClientOptions } from '../lib/query-client';
import { signInPath } from './loaders';
import { createAppRoutes } from './routes';

export type AppRouter = ReturnType<typeof createBrowserRouter>;

export type ShadowloopApp = { router: AppRouter; queryClient: QueryClient };

type CreateAppOptions = {
  createRouter?: (routes: RouteObject[]) => AppRouter;
  queryClient?: Omit<QueryClientOptions, 'onUnauthorized'>;
};

/**
 * A 401 from any query outside a navigation means the session ended: go to the sign-in page.
 * During a navigation the frame's loader already redirects, so the handler stays out of its way.
 */
export function createShadowloopApp(options: CreateAppOptions = {}): ShadowloopApp {
  const current: { router?: AppRouter } = {};
  const queryClient = createQueryClient({
    ...options.queryClient,
    onUnauthorized: () => {
      const router = current.router;
      if (!router) return;
      const { initialized, navigation, location } = router.state;
      if (!initialized || navigation.state !== 'idle' || location.pathname === '/signin') return;
      const target = signInPath(location.pathname + location.search);
      void Promise.resolve(router.navigate(target, { replace: true })).then(() => queryClient.clear());
    },
  });
  const createRouter = options.createRouter ?? ((routes) => createBrowserRouter(routes));
  const router = createRouter(createAppRoutes(queryClient));
  current.router = router;
  return { router, queryClient };
}
