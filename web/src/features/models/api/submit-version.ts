import { useVersionAction } from './use-version-action';

/** The submit body; the backtests listed are attached as evidence in the same transaction. */
export type SubmitBody = { justification?: string; backtestIds?: string[] };

export function useSubmitVersion(versionId: string) {
  return useVersionAction<SubmitBody>(versionId, 'submit');
}
