import { useSuspenseQuery } from '@tanstack/react-query';
import { meQueryOptions } from './api/get-me';
import type { SignedInUser } from './roles';

/** The frame's loader has already loaded the user, so this never suspends in practice. */
export function useSignedInUser(): SignedInUser {
  return useSuspenseQuery(meQueryOptions()).data;
}
