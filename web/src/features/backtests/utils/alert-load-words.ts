import type { StatusTone } from '../../../components/ui/status-word';
import { formatDuration, formatNumber, plural } from '../../../lib/format-number';
import type { RuleReplay } from '../types';

export type AlertLoadVerdict = { word: string; tone: StatusTone; sentence: string };

/**
 * The replay's alert load against the alert settings' target: "19 alerts in 7 days, 2.7 a day
 * against the target of 6 a day". A rate over less than a day is projected, and says so.
 */
export function alertLoadVerdict(
  replay: Pick<RuleReplay, 'total' | 'days' | 'perDay' | 'targetPerDay'>,
): AlertLoadVerdict {
  const over = replay.perDay > replay.targetPerDay;
  const days = formatNumber(replay.days, 3);
  const span = replay.days >= 1 ? `${days} ${days === '1' ? 'day' : 'days'}` : formatDuration(replay.days * 86_400);
  const rate = `${formatNumber(replay.perDay, 3)} a day${replay.days < 1 ? ' (projected from a shorter range)' : ''}`;
  return {
    word: over ? 'over the target' : 'within the target',
    tone: over ? 'drifting' : 'in_step',
    sentence: `${plural(replay.total, 'alert')} in ${span}: ${rate} against the target of ${formatNumber(replay.targetPerDay, 3)} a day.`,
  };
}
