import type { AlertLoad } from '@shadowloop/api/contracts';
import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatDuration } from '../../../lib/format-number';
import { formatPlantTime } from '../../../lib/plant-time';
import { RULE_WORDS } from '../utils/alert-words';

function Block({ title, empty, rows, children }: { title: string; empty: string; rows: number; children: ReactNode }) {
  return (
    <section aria-label={title} className="space-y-1">
      <h3 className="font-bold">{title}</h3>
      {rows ? children : <p className="text-sm text-ink/75">{empty}</p>}
    </section>
  );
}

const at = (iso: string, timeZone: string) =>
  formatPlantTime(Date.parse(iso), timeZone, { date: true, seconds: false });

export function FloodsTable({ load, timeZone }: { load: AlertLoad; timeZone: string }) {
  return (
    <Block
      title="Floods"
      rows={load.floods.length}
      empty={`No flood: never more than ${load.targets.floodPer10Min} alerts in 10 minutes.`}
    >
      <Table caption="Floods">
        <thead>
          <tr>
            <Th>From</Th>
            <Th>To</Th>
            <Th>Alerts</Th>
          </tr>
        </thead>
        <tbody className="tabular-nums">
          {load.floods.map((flood) => (
            <tr key={flood.start}>
              <Td>{at(flood.start, timeZone)}</Td>
              <Td>{at(flood.end, timeZone)}</Td>
              <Td>{flood.count}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </Block>
  );
}

export function ChatteringTable({ load }: { load: AlertLoad }) {
  return (
    <Block title="Chattering" rows={load.chattering.length} empty="No alert came back within a minute of clearing.">
      <Table caption="Chattering alerts">
        <thead>
          <tr>
            <Th>Alert</Th>
            <Th>Rule</Th>
            <Th>Back within a minute</Th>
          </tr>
        </thead>
        <tbody className="tabular-nums">
          {load.chattering.map((row) => (
            <tr key={row.alertId}>
              <Td>
                <Link to={`/alerts/${row.alertId}`} className="underline">
                  {row.loopTag}
                </Link>
              </Td>
              <Td>{RULE_WORDS[row.rule]}</Td>
              <Td>{row.repeats} times</Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </Block>
  );
}

export function StaleTable({ load, timeZone }: { load: AlertLoad; timeZone: string }) {
  return (
    <Block title="Stale alerts" rows={load.stale.length} empty="No alert has been active for longer than a day.">
      <Table caption="Stale alerts">
        <thead>
          <tr>
            <Th>Alert</Th>
            <Th>Rule</Th>
            <Th>Raised</Th>
            <Th>Active for</Th>
          </tr>
        </thead>
        <tbody className="tabular-nums">
          {load.stale.map((row) => (
            <tr key={row.alertId}>
              <Td>
                <Link to={`/alerts/${row.alertId}`} className="underline">
                  {row.loopTag}
                </Link>
              </Td>
              <Td>{RULE_WORDS[row.rule]}</Td>
              <Td>{at(row.raisedAt, timeZone)}</Td>
              <Td>{formatDuration(row.hours * 3600)}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </Block>
  );
}

export function TopLoopsTable({ load }: { load: AlertLoad }) {
  return (
    <Block
      title="The ten loops raising most"
      rows={load.topLoops.length}
      empty="No loop raised an alert in this range."
    >
      <Table caption="The ten loops raising most">
        <thead>
          <tr>
            <Th>Loop</Th>
            <Th>Alerts raised</Th>
          </tr>
        </thead>
        <tbody className="tabular-nums">
          {load.topLoops.map((row) => (
            <tr key={row.loopId}>
              <Td>
                <Link to={`/loops/${row.loopId}/alerts`} className="font-medium underline">
                  {row.loopTag}
                </Link>{' '}
                {row.loopName}
              </Td>
              <Td>{row.count}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </Block>
  );
}
