import type { QueryClient } from '@tanstack/react-query';
import { Navigate, type RouteObject } from 'react-router';
import { PageLoading } from '../../../components/ui/page-loading';
import { accessTokensQueryOptions } from '../../../features/access-tokens/api/get-access-tokens';
import { openApiQueryOptions } from '../../../features/api-reference/api/get-openapi';
import { auditLogQueryOptions, parseAuditSearch } from '../../../features/audit/api/get-audit-log';
import { devMailQueryOptions } from '../../../features/dev-mail/api/get-dev-mail';
import { ingestSourcesQueryOptions } from '../../../features/ingest-sources/api/get-ingest-sources';
import { usersQueryOptions } from '../../../features/users/api/get-users';
import { warmCacheLoader } from '../../loaders';
import { AdminAccessTokensPage } from './access-tokens';
import { AdminLayout } from './admin-layout';
import { AdminAuditPage } from './audit';
import { AdminDevMailPage } from './dev-mail';
import { AdminIngestSourcesPage } from './ingest-sources';
import { AdminUsersPage } from './users';

const apiReferencePage = async () => ({ Component: (await import('./api-reference')).AdminApiReferencePage });

export function adminRoutes(queryClient: QueryClient): RouteObject[] {
  const adminOnly = 'admin' as const;
  return [
    {
      element: <AdminLayout />,
      children: [
        { index: true, element: <Navigate to="users" replace /> },
        {
          path: 'users',
          loader: warmCacheLoader(queryClient, () => usersQueryOptions(), adminOnly),
          HydrateFallback: PageLoading,
          element: <AdminUsersPage />,
        },
        {
          path: 'ingest-sources',
          loader: warmCacheLoader(queryClient, () => ingestSourcesQueryOptions(), adminOnly),
          HydrateFallback: PageLoading,
          element: <AdminIngestSourcesPage />,
        },
        {
          path: 'access-tokens',
          loader: warmCacheLoader(queryClient, () => accessTokensQueryOptions('all'), adminOnly),
          HydrateFallback: PageLoading,
          element: <AdminAccessTokensPage />,
        },
        {
          path: 'dev-mail',
          loader: warmCacheLoader(queryClient, () => devMailQueryOptions(), adminOnly),
          HydrateFallback: PageLoading,
          element: <AdminDevMailPage />,
        },
        {
          path: 'audit',
          loader: warmCacheLoader(
            queryClient,
            ({ request }) => auditLogQueryOptions(parseAuditSearch(new URL(request.url).searchParams)),
            adminOnly,
          ),
          HydrateFallback: PageLoading,
          element: <AdminAuditPage />,
        },
        {
          path: 'api',
          loader: warmCacheLoader(queryClient, () => openApiQueryOptions(), adminOnly),
          HydrateFallback: PageLoading,
          lazy: apiReferencePage,
        },
      ],
    },
  ];
}
