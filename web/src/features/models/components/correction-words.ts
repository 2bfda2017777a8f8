import type { CorrectionMode } from '../types';

export const CORRECTION_WORDS: Record<CorrectionMode, { name: string; explanation: string }> = {
  free_run: {
    name: 'Free run',
    explanation:
      'The twin runs on the measured inputs alone and never looks at the measured outputs, so any drift of the plant shows in full.',
  },
  reset: {
    name: 'Reset to the measurement',
    explanation:
      'Every sample the twin restarts from the state read off the measurements, so it predicts one sample ahead at a time.',
  },
  kalman: {
    name: 'Kalman correction',
    explanation:
      'Every sample the twin pulls its state towards the measurements with the steady-state Kalman gain K computed from Q and R.',
  },
};
