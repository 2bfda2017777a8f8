import { useVersionAction } from './use-version-action';

export type RetireBody = { note?: string };

export function useRetireVersion(versionId: string) {
  return useVersionAction<RetireBody>(versionId, 'retire');
}
