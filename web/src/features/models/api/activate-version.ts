import { useVersionAction } from './use-version-action';

export type ActivateBody = { acknowledgeCautions: true };

export function useActivateVersion(versionId: string) {
  return useVersionAction<ActivateBody>(versionId, 'activate');
}
