import type { AlertState } from '@shadowloop/api/contracts';
import { StatusWord } from '../../../components/ui/status-word';
import { conditionWord, type TimedCondition } from '../utils/alert-times';
import { ALERT_STATE_TONES, ALERT_STATE_WORDS } from '../utils/alert-words';

export function AlertStateWord({ state }: { state: AlertState }) {
  return <StatusWord tone={ALERT_STATE_TONES[state]} label={ALERT_STATE_WORDS[state]} />;
}

/** Whether the condition is present now, in words. */
export function ConditionWord({ alert }: { alert: TimedCondition }) {
  const word = conditionWord(alert);
  return <StatusWord tone={word === 'active' ? 'diverged' : 'none'} label={word} />;
}
