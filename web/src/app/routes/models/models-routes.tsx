import type { QueryClient } from '@tanstack/react-query';
import type { RouteObject } from 'react-router';
import { PageLoading } from '../../../components/ui/page-loading';
import { loopsQueryOptions } from '../../../features/loops/api/get-loops';
import { modelVersionQueryOptions } from '../../../features/models/api/get-model-version';
import { warmCacheLoader } from '../../loaders';
import { LoopVersionsPage } from './loop-versions';
import { ModelsAuditPage } from './models-audit';
import { ModelsLayout } from './models-layout';
import { ModelsRegistryPage } from './registry';

const engineer = 'engineer' as const;

/** The editor and the analysis pages carry the charts; they load when first opened. */
const analysisPage = async () => ({ Component: (await import('./version-analysis')).VersionAnalysisPage });
const comparePage = async () => ({ Component: (await import('./compare-versions')).CompareVersionsPage });
const newVersionPage = async () => ({ Component: (await import('./new-version')).NewVersionPage });

export function modelRoutes(queryClient: QueryClient): RouteObject[] {
  const versionLoader = warmCacheLoader(
    queryClient,
    ({ params }) => modelVersionQueryOptions(params.versionId ?? ''),
    engineer,
  );
  return [
    {
      element: <ModelsLayout />,
      children: [
        {
          index: true,
          loader: warmCacheLoader(queryClient, () => loopsQueryOptions(), engineer),
          HydrateFallback: PageLoading,
          element: <ModelsRegistryPage />,
        },
        { path: 'audit', element: <ModelsAuditPage /> },
      ],
    },
    {
      path: 'versions/:versionId',
      loader: versionLoader,
      HydrateFallback: PageLoading,
      lazy: analysisPage,
    },
    {
      path: 'versions/:versionId/compare',
      loader: versionLoader,
      HydrateFallback: PageLoading,
      lazy: comparePage,
    },
    { path: ':loopId', element: <LoopVersionsPage /> },
    { path: ':loopId/new', HydrateFallback: PageLoading, lazy: newVersionPage },
  ];
}
