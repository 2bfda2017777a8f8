import type { AlertEvent, AlertRuleKind, AlertState, CloseCause, Priority } from '@shadowloop/api/contracts';
import type { StatusTone } from '../../../components/ui/status-word';

export const ALERT_STATE_WORDS: Record<AlertState, string> = {
  unacknowledged: 'unacknowledged',
  acknowledged: 'acknowledged',
  returned_unacknowledged: 'cleared, not acknowledged',
  shelved: 'shelved',
  closed: 'closed',
};

export const ALERT_STATE_TONES: Record<AlertState, StatusTone> = {
  unacknowledged: 'diverged',
  returned_unacknowledged: 'drifting',
  acknowledged: 'ready',
  shelved: 'stale',
  closed: 'none',
};

export const RULE_WORDS: Record<AlertRuleKind, string> = {
  band: 'band',
  cusum: 'CUSUM',
  nis: 'chi-square on the innovation',
  stale: 'stale readings',
  model: 'unstable model',
};

export const PRIORITY_WORDS: Record<Priority, string> = { 1: 'high', 2: 'medium', 3: 'low' };

/** Plain labels of the close causes, in the order the form offers them. */
export const CLOSE_CAUSE_LABELS: Record<CloseCause, string> = {
  sensor_fault: 'Sensor fault — a transmitter or analyser read wrong',
  actuator_fault: 'Actuator fault — a valve, pump or blower did not do what it was told',
  process_change: 'Process change — the plant really behaves differently now',
  model_out_of_date: 'Model out of date — the model needs a new version',
  other: 'Other — say what in the note',
};

export const CLOSE_CAUSE_SHORT: Record<CloseCause, string> = {
  sensor_fault: 'sensor fault',
  actuator_fault: 'actuator fault',
  process_change: 'process change',
  model_out_of_date: 'model out of date',
  other: 'other',
};

export const EVENT_WORDS: Record<AlertEvent['kind'], string> = {
  raised: 'Raised',
  reactivated: 'Raised again',
  cleared: 'Condition cleared',
  acknowledged: 'Acknowledged',
  shelved: 'Shelved',
  unshelved: 'Shelf ended',
  closed: 'Closed',
  notified: 'Notified by e-mail',
  escalated: 'Escalated',
};

/** A waiting alert is one nobody has acknowledged yet, whether or not its condition has cleared. */
export const isWaiting = (state: AlertState) => state === 'unacknowledged' || state === 'returned_unacknowledged';

export const alertTitle = (alert: { number: number; loopTag: string; rule: AlertRuleKind }) =>
  `Alert ${alert.number} · ${alert.loopTag} ${RULE_WORDS[alert.rule]}`;
