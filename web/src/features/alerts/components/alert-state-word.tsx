import type { AlertState } from '@shadowloop/api/contracts';
import { StatusWord } from '../../../components/ui/status-word';
import { ALERT_STATE_TONES, ALERT_STATE_WORDS } from '../utils/alert-words';

export function AlertStateWord({ state }: { state: AlertState }) {
  return <StatusWord tone={ALERT_STATE_TONES[state]} label={ALERT_STATE_WORDS[state]} />;
}

/** Whether the condition is present now, in words. */
export function ConditionWord({ active }: { active: boolean }) {
  return <StatusWord tone={active ? 'diverged' : 'none'} label={active ? 'active' : 'cleared'} />;
}
