import { useVersionAction } from './use-version-action';

export type SubmitBody = { justification?: string };

export function useSubmitVersion(versionId: string) {
  return useVersionAction<SubmitBody>(versionId, 'submit');
}
