import { useEffect, useState, useSyncExternalStore } from 'react';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatNumber } from '../../../lib/format-number';
import { formatPlantTime } from '../../../lib/plant-time';
import type { Loop } from '../../loops/api/get-loops';
import type { CursorStore } from '../utils/cursor-store';
import type { LiveTrend } from '../utils/live-trend';
import { readoutAt } from '../utils/readout';

const withUnit = (value: number | null, unit: string) =>
  value === null ? '—' : `${formatNumber(value)}${unit ? ` ${unit}` : ''}`;
const HEADINGS = ['Signal', 'Measured', 'Predicted', 'Residual', 'Forecast', 'Move preview'];

/** The numbers behind the charts at the pointer's time, or the newest ones, with units. */
export function CursorReadout({ loop, trend, cursor }: { loop: Loop; trend: LiveTrend; cursor: CursorStore }) {
  const t = useSyncExternalStore(cursor.subscribe, cursor.get);
  const [, setTick] = useState(0);
  useEffect(() => {
    if (t !== null) return;
    const timer = setInterval(() => setTick((n) => n + 1), 1000);
    return () => clearInterval(timer);
  }, [t]);

  const readout = readoutAt(trend.rows(), trend.source.layout, trend.overlays, t);
  const when = readout ? formatPlantTime(readout.t * 1000, loop.timeZone, { date: true }) : '—';
  return (
    <section aria-label="Readout" className="space-y-1">
      <h2 className="text-sm font-bold">
        {t === null ? `Newest values, ${when}` : `Values at ${when}`}
        <span className="ml-2 font-normal text-ink/70">
          {t === null
            ? 'Point at a chart to read another time.'
            : 'Move the pointer off the charts for the newest values.'}
        </span>
      </h2>
      <Table caption="Readout at the chosen time">
        <thead>
          <tr>
            {HEADINGS.map((heading) => (
              <Th key={heading}>{heading}</Th>
            ))}
          </tr>
        </thead>
        <tbody className="tabular-nums">
          {loop.outputs.map((signal, i) => {
            const o = readout?.outputs[i];
            return (
              <tr key={`y${i}`}>
                <Td className="font-medium">{signal.name}</Td>
                <Td>{withUnit(o?.measured ?? null, signal.unit)}</Td>
                <Td className="text-twin">{withUnit(o?.predicted ?? null, signal.unit)}</Td>
                <Td>{withUnit(o?.residual ?? null, signal.unit)}</Td>
                <Td className="text-twin">{withUnit(o?.forecast ?? null, signal.unit)}</Td>
                <Td className="text-twin">{withUnit(o?.preview ?? null, signal.unit)}</Td>
              </tr>
            );
          })}
          {loop.inputs.map((signal, i) => (
            <tr key={`u${i}`}>
              <Td className="font-medium">{signal.name} (input)</Td>
              <Td>{withUnit(readout?.inputs[i] ?? null, signal.unit)}</Td>
              <Td colSpan={4} className="text-ink/60">
                —
              </Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </section>
  );
}
