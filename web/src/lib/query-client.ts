import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from './api';

export type QueryClientOptions = {
  onUnauthorized?: () => void;
  retry?: boolean | number;
};

function isUnauthorized(error: unknown): boolean {
  return isApiError(error) && error.status === 401;
}

function retryUnlessClientError(failureCount: number, error: unknown): boolean {
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

export function createQueryClient(options: QueryClientOptions = {}): QueryClient {
  const reportUnauthorized = (error: unknown) => {
    if (isUnauthorized(error)) options.onUnauthorized?.();
  };
  return new QueryClient({
    queryCache: new QueryCache({ onError: reportUnauthorized }),
    mutationCache: new MutationCache({ onError: reportUnauthorized }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        retry: options.retry ?? retryUnlessClientError,
      },
      mutations: { retry: false },
    },
  });
}
