import type { DriftRuleKind } from '@shadowloop/api/contracts';

export const RULE_KINDS: DriftRuleKind[] = ['band', 'cusum', 'nis', 'stale'];

export const RULE_TITLES: Record<DriftRuleKind, string> = {
  band: 'Band with persistence',
  cusum: 'CUSUM',
  nis: 'Chi-square on the innovation (NIS)',
  stale: 'Stale readings',
};

export const RULE_EXPLANATIONS: Record<DriftRuleKind, string> = {
  band: 'Raises when a residual stays outside its limit for several samples in a row, and clears only after it has been back inside a narrower band for several samples, so it does not chatter.',
  cusum:
    'Adds up the standardised residual of each output, less an allowance k, in both directions; raises when either sum passes h. It finds small, lasting offsets that a band misses.',
  nis: 'Compares the normalised innovation squared of all outputs together with the chi-square limit for the chosen false-alarm probability; raises when it stays above for several samples.',
  stale: 'Raises when no reading has arrived for a number of sample periods.',
};
