import type { FetchQueryOptions, QueryClient, QueryKey } from '@tanstack/react-query';
import { redirect, type LoaderFunctionArgs } from 'react-router';
import { meQueryOptions } from '../features/session/api/get-me';
import { hasRole, type Role, type SignedInUser } from '../features/session/roles';
import { isApiError } from '../lib/api';

/** The sign-in page, remembering where to come back to after the identity provider. */
export function signInPath(returnTo: string): string {
  return returnTo === '/' || returnTo.startsWith('/signin')
    ? '/signin'
    : `/signin?returnTo=${encodeURIComponent(returnTo)}`;
}

/** The frame needs the signed-in user; without a session the only useful place is the sign-in page. */
export function signedInUserLoader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs): Promise<SignedInUser> => {
    try {
      return await queryClient.ensureQueryData(meQueryOptions());
    } catch (error) {
      if (isApiError(error) && error.status === 401) {
        const url = new URL(request.url);
        throw redirect(signInPath(url.pathname + url.search));
      }
      throw error;
    }
  };
}

/**
 * Starts a page's queries before it renders. Errors are left to the page, which shows them in
 * place; a role the user lacks skips the request, and the route's guard explains instead.
 */
export function warmCacheLoader<TData, TKey extends QueryKey>(
  queryClient: QueryClient,
  optionsFor: (args: LoaderFunctionArgs) => FetchQueryOptions<TData, Error, TData, TKey>,
  requiredRole?: Role,
) {
  return async (args: LoaderFunctionArgs): Promise<null> => {
    if (requiredRole) {
      const user = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
      if (!user || !hasRole(user, requiredRole)) return null;
    }
    await queryClient.prefetchQuery(optionsFor(args));
    return null;
  };
}
