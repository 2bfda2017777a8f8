import type { Alert } from '@shadowloop/api/contracts';
import { Link } from 'react-router';
import { SkeletonRows, Table, Td, Th } from '../../../components/ui/table';
import { formatPlantTime } from '../../../lib/plant-time';
import { conditionDuration } from '../utils/alert-times';
import { isWaiting, RULE_WORDS } from '../utils/alert-words';
import { AlertStateWord, ConditionWord } from './alert-state-word';
import { PriorityBadge } from './priority-badge';

export type AlertSelection = {
  selected: ReadonlySet<string>;
  onToggle: (alertId: string) => void;
  onToggleAll: (alertIds: string[], select: boolean) => void;
};

type AlertsTableProps = {
  caption: string;
  alerts: Alert[] | undefined;
  timeZone: string;
  nowMs: number;
  /** Present for people who may acknowledge: a tick box on each waiting alert. */
  selection?: AlertSelection;
  /** The loop column is left out where every alert is of one loop. */
  showLoop?: boolean;
};

const when = (iso: string, timeZone: string) =>
  formatPlantTime(Date.parse(iso), timeZone, { date: true, seconds: false });

function AcknowledgedBy({ alert, timeZone }: { alert: Alert; timeZone: string }) {
  if (!alert.acknowledgedBy) return <span className="text-ink/70">{isWaiting(alert.state) ? 'nobody yet' : '—'}</span>;
  return (
    <span>
      {alert.acknowledgedBy.name}
      {alert.acknowledgedAt ? (
        <span className="block text-xs text-ink/70">{when(alert.acknowledgedAt, timeZone)}</span>
      ) : null}
    </span>
  );
}

function SelectAll({ alerts, selection }: { alerts: Alert[]; selection: AlertSelection }) {
  const waiting = alerts.filter((a) => isWaiting(a.state)).map((a) => a.id);
  const all = waiting.length > 0 && waiting.every((id) => selection.selected.has(id));
  return (
    <input
      type="checkbox"
      aria-label="Select every waiting alert shown"
      disabled={waiting.length === 0}
      checked={all}
      onChange={() => selection.onToggleAll(waiting, !all)}
    />
  );
}

export function AlertsTable({ caption, alerts, timeZone, nowMs, selection, showLoop = true }: AlertsTableProps) {
  const columns = 8 + (selection ? 1 : 0) + (showLoop ? 1 : 0);
  return (
    <Table caption={caption}>
      <thead>
        <tr>
          {selection ? (
            <Th className="w-8">{alerts ? <SelectAll alerts={alerts} selection={selection} /> : null}</Th>
          ) : null}
          <Th>Alert</Th>
          <Th>Priority</Th>
          {showLoop ? <Th>Loop</Th> : null}
          <Th>Rule</Th>
          <Th>State</Th>
          <Th>Condition</Th>
          <Th>Raised ({timeZone})</Th>
          <Th>For how long</Th>
          <Th>Acknowledged by</Th>
        </tr>
      </thead>
      <tbody className="tabular-nums">
        {!alerts ? <SkeletonRows columns={columns} /> : null}
        {alerts?.map((alert) => (
          <tr key={alert.id} className={isWaiting(alert.state) ? 'bg-diverged/5' : undefined}>
            {selection ? (
              <Td>
                {isWaiting(alert.state) ? (
                  <input
                    type="checkbox"
                    aria-label={`Select alert ${alert.number}`}
                    checked={selection.selected.has(alert.id)}
                    onChange={() => selection.onToggle(alert.id)}
                  />
                ) : null}
              </Td>
            ) : null}
            <Td>
              <Link to={`/alerts/${alert.id}`} className="whitespace-nowrap font-medium underline">
                Alert {alert.number}
              </Link>
            </Td>
            <Td>
              <PriorityBadge priority={alert.priority} />
            </Td>
            {showLoop ? (
              <Td>
                <Link to={`/loops/${alert.loopId}`} className="font-medium hover:underline">
                  {alert.loopTag}
                </Link>
                <span className="block text-xs text-ink/75">{alert.loopName}</span>
              </Td>
            ) : null}
            <Td>{RULE_WORDS[alert.rule]}</Td>
            <Td>
              <AlertStateWord state={alert.state} />
            </Td>
            <Td>
              <ConditionWord alert={alert} />
            </Td>
            <Td className="whitespace-nowrap">{when(alert.raisedAt, timeZone)}</Td>
            <Td className="whitespace-nowrap">{conditionDuration(alert, nowMs)}</Td>
            <Td>
              <AcknowledgedBy alert={alert} timeZone={timeZone} />
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
