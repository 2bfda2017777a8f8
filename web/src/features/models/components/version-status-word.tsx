import { StatusWord, type StatusTone } from '../../../components/ui/status-word';
import type { VersionStatus } from '../types';

export const VERSION_STATUS_WORDS: Record<VersionStatus, string> = {
  draft: 'draft',
  in_review: 'in review',
  approved: 'approved',
  active: 'active',
  retired: 'retired',
  rejected: 'rejected',
};

const TONES: Record<VersionStatus, StatusTone> = {
  draft: 'none',
  in_review: 'twin',
  approved: 'ready',
  active: 'in_step',
  retired: 'stale',
  rejected: 'diverged',
};

export function VersionStatusWord({ status }: { status: VersionStatus }) {
  return <StatusWord tone={TONES[status]} label={VERSION_STATUS_WORDS[status]} />;
}
