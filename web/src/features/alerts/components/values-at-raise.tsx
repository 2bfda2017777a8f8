import type { AlertDetail } from '@shadowloop/api/contracts';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatNumber } from '../../../lib/format-number';
import { formatPlantTime } from '../../../lib/plant-time';

const withUnit = (value: number | null | undefined, unit: string) =>
  value === null || value === undefined ? '—' : `${formatNumber(value)}${unit ? ` ${unit}` : ''}`;

/** The rule's statistic against its limit and each output's values at the sample that raised the alert. */
export function ValuesAtRaise({ detail, timeZone }: { detail: AlertDetail; timeZone: string }) {
  const signals = detail.signals ?? [];
  return (
    <div className="space-y-2 text-sm">
      {detail.statistic ? (
        <p className="tabular-nums">
          {detail.statistic}: <span className="font-bold">{formatNumber(detail.value)}</span>
          {detail.limit !== undefined && detail.limit !== null ? (
            <> against a limit of {formatNumber(detail.limit)}</>
          ) : null}
          {detail.slotAt ? <> at {formatPlantTime(Date.parse(detail.slotAt), timeZone, { date: true })}</> : null}
        </p>
      ) : null}
      {signals.length ? (
        <Table caption="Values at the raise">
          <thead>
            <tr>
              <Th>Output</Th>
              <Th>Measured</Th>
              <Th>Predicted</Th>
              <Th>Residual</Th>
              <Th>Limit</Th>
            </tr>
          </thead>
          <tbody className="tabular-nums">
            {signals.map((signal) => (
              <tr key={signal.name}>
                <Td>{signal.name}</Td>
                <Td>{withUnit(signal.measured, signal.unit)}</Td>
                <Td>{withUnit(signal.predicted, signal.unit)}</Td>
                <Td>{withUnit(signal.residual, signal.unit)}</Td>
                <Td>{withUnit(signal.limit, signal.unit)}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      ) : (
        <p className="text-ink/75">No output values were stored with this alert.</p>
      )}
    </div>
  );
}
