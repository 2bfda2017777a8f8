import type { Alert } from '@shadowloop/api/contracts';
import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { formatPlantTime } from '../../../lib/plant-time';
import { conditionDuration } from '../utils/alert-times';
import { CLOSE_CAUSE_SHORT, RULE_WORDS } from '../utils/alert-words';
import { ConditionWord } from './alert-state-word';

const ESCALATION_WORDS = ['not escalated: the primary on call', 'to the secondary on call', "to the area's engineers"];

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-xs font-bold uppercase tracking-wide text-ink/70">{label}</dt>
      <dd className="tabular-nums">{children}</dd>
    </div>
  );
}

/** Who, what and when of one alert, in a dense grid. */
export function AlertFacts({ alert, timeZone, nowMs }: { alert: Alert; timeZone: string; nowMs: number }) {
  const at = (iso: string | null) => (iso ? formatPlantTime(Date.parse(iso), timeZone, { date: true }) : '—');
  return (
    <dl className="grid grid-cols-2 gap-x-6 gap-y-2 rounded-sm border border-rule bg-panel px-4 py-3 text-sm md:grid-cols-4">
      <Fact label="Loop">
        <Link to={`/loops/${alert.loopId}`} className="font-medium underline">
          {alert.loopTag}
        </Link>{' '}
        {alert.loopName}
      </Fact>
      <Fact label="Rule">
        {RULE_WORDS[alert.rule]}
        {alert.ruleVersion !== null ? `, version ${alert.ruleVersion}` : ''}
      </Fact>
      <Fact label="Raised">
        {at(alert.raisedAt)}
        {alert.activations > 1 ? `; again ${at(alert.activeSince)}` : ''}
      </Fact>
      <Fact label="Condition">
        <ConditionWord alert={alert} /> <span className="text-ink/75">{conditionDuration(alert, nowMs)}</span>
      </Fact>
      <Fact label="Times raised">{alert.activations}</Fact>
      <Fact label="Escalation">{ESCALATION_WORDS[Math.max(0, Math.min(alert.escalationLevel, 2))]}</Fact>
      <Fact label="Acknowledged">
        {alert.acknowledgedBy ? `${alert.acknowledgedBy.name}, ${at(alert.acknowledgedAt)}` : 'not yet'}
      </Fact>
      {alert.shelvedUntil ? (
        <Fact label="Shelved until">
          {at(alert.shelvedUntil)}
          {alert.shelveReason ? ` — ${alert.shelveReason}` : ''}
        </Fact>
      ) : null}
      {alert.closedAt ? (
        <Fact label="Closed">
          {alert.closedBy?.name ?? 'Shadowloop'}, {at(alert.closedAt)}
          {alert.closeCause ? ` — ${CLOSE_CAUSE_SHORT[alert.closeCause]}` : ''}
          {alert.closeNote ? `: ${alert.closeNote}` : ''}
        </Fact>
      ) : null}
    </dl>
  );
}
