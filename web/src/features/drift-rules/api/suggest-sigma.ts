import { apiFetch } from '../../../lib/api';
import { rulesPath } from './get-drift-rules';

import type { DriftRuleSuggestion } from '@shadowloop/api/contracts';

export type { DriftRuleSuggestion };

/** Each output's residual standard deviation from the loop's running statistics. */
export function suggestSigma(loopId: string): Promise<DriftRuleSuggestion> {
  return apiFetch<DriftRuleSuggestion>(`${rulesPath(loopId)}/suggest`);
}
