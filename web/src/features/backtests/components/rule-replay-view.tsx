import { StatusWord } from '../../../components/ui/status-word';
import { Table, Td, Th } from '../../../components/ui/table';
import { plural } from '../../../lib/format-number';
import { formatPlantTime } from '../../../lib/plant-time';
import { RULE_TITLES } from '../../drift-rules/utils/rule-words';
import type { RuleReplay } from '../types';
import { alertLoadVerdict } from '../utils/alert-load-words';

const SHOWN_FIRST = 10;

const ruleTitle = (kind: string) => RULE_TITLES[kind as keyof typeof RULE_TITLES] ?? kind;

function RaisesTable({ alerts, timeZone }: { alerts: RuleReplay['alerts']; timeZone: string }) {
  const at = (iso: string | null) =>
    iso ? formatPlantTime(Date.parse(iso), timeZone, { date: true }) : 'still raised at the end';
  return (
    <Table caption="Raises of the replay, in time order">
      <thead>
        <tr>
          <Th>Raised</Th>
          <Th>Cleared</Th>
          <Th>Rule</Th>
          <Th>Statistic at the raise</Th>
        </tr>
      </thead>
      <tbody className="tabular-nums">
        {alerts.map((alert, i) => (
          <tr key={`${alert.ruleId}-${alert.raisedAt}-${i}`}>
            <Td>{at(alert.raisedAt)}</Td>
            <Td>{at(alert.clearedAt)}</Td>
            <Td>{ruleTitle(alert.kind)}</Td>
            <Td>{alert.statistic}</Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

/** The loop's drift rules replayed on this version's one-step residuals: how many, when, and the load per day. */
export function RuleReplayView({ replay, timeZone }: { replay: RuleReplay; timeZone: string }) {
  const load = alertLoadVerdict(replay);
  const allRaises = replay.rules.reduce((sum, rule) => sum + rule.raises, 0);
  return (
    <section aria-label="Drift rules replayed" className="space-y-2 text-sm">
      <h4 className="font-bold">Drift rules replayed on the one-step residuals</h4>
      {replay.rules.length === 0 ? (
        <p>The loop has no drift rules, so this version would have raised nothing.</p>
      ) : (
        <>
          <p className="flex flex-wrap items-center gap-x-3">
            <StatusWord tone={load.tone} label={load.word} />
            <span>{load.sentence}</span>
          </p>
          <ul className="flex flex-wrap gap-x-5">
            {replay.rules.map((rule) => (
              <li key={rule.ruleId}>
                {ruleTitle(rule.kind)} (priority {rule.priority}): {plural(rule.raises, 'raise')}
                {rule.enabled ? '' : ' — switched off, replayed but not counted'}
              </li>
            ))}
          </ul>
        </>
      )}
      {replay.alerts.length ? (
        <>
          <RaisesTable alerts={replay.alerts.slice(0, SHOWN_FIRST)} timeZone={timeZone} />
          {replay.alerts.length > SHOWN_FIRST ? (
            <details>
              <summary className="cursor-pointer">Show all {replay.alerts.length} listed raises</summary>
              <RaisesTable alerts={replay.alerts.slice(SHOWN_FIRST)} timeZone={timeZone} />
            </details>
          ) : null}
          {allRaises > replay.alerts.length ? (
            <p className="text-xs text-ink/75">
              The first {replay.alerts.length} of {allRaises} raises are listed; the counts cover all of them.
            </p>
          ) : null}
        </>
      ) : null}
    </section>
  );
}
