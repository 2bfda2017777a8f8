import { StatusWord, type StatusTone } from '../../../components/ui/status-word';
import type { TrackingStatus } from '../api/get-loops';

export const TRACKING_STATUS_WORDS: Record<TrackingStatus, string> = {
  in_step: 'in step',
  drifting: 'drifting',
  diverged: 'diverged',
  stale: 'stale',
  no_twin: 'no twin running',
};

const TONES: Record<TrackingStatus, StatusTone> = {
  in_step: 'in_step',
  drifting: 'drifting',
  diverged: 'diverged',
  stale: 'stale',
  no_twin: 'none',
};

export function TrackingStatusWord({ status }: { status: TrackingStatus }) {
  return <StatusWord tone={TONES[status]} label={TRACKING_STATUS_WORDS[status]} />;
}
