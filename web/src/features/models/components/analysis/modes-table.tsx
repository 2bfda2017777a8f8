import { Table, Td, Th } from '../../../../components/ui/table';
import { formatDuration, formatEigenvalue, formatNumber } from '../../../../lib/format-number';
import type { Mode } from '../../types';
import { MODE_MARK_WORDS, modeRows, type ModeMark } from '../../utils/mode-rows';

const MARK_CLASSES: Record<ModeMark, string> = {
  slowest: 'border-ink/60',
  divergent: 'border-diverged text-diverged',
  'on-circle': 'border-drifting',
};

function Marks({ marks }: { marks: ModeMark[] }) {
  return (
    <span className="flex flex-wrap gap-1">
      {marks.map((mark) => (
        <span key={mark} className={`rounded-sm border px-1 text-xs font-medium ${MARK_CLASSES[mark]}`}>
          {MODE_MARK_WORDS[mark]}
        </span>
      ))}
    </span>
  );
}

/** Every mode (a conjugate pair on one row), slowest first, in the units an engineer thinks in. */
export function ModesTable({ modes, samplePeriodS }: { modes: Mode[]; samplePeriodS: number }) {
  const rows = modeRows(modes, samplePeriodS);
  return (
    <Table caption="Modes of the model, slowest first">
      <thead>
        <tr>
          <Th>
            <span className="normal-case">λ</span>
          </Th>
          <Th>
            <span className="normal-case">|λ|</span>
          </Th>
          <Th>Time constant</Th>
          <Th>
            Settles in <span className="normal-case">(4 τ)</span>
          </Th>
          <Th>Period</Th>
          <Th>Damping ratio</Th>
          <Th>Natural frequency</Th>
          <Th>Notes</Th>
        </tr>
      </thead>
      <tbody className="tabular-nums">
        {rows.map((row, index) => (
          <tr key={index} className={row.marks.includes('divergent') ? 'bg-diverged/5' : undefined}>
            <Td className="whitespace-nowrap font-medium">
              {formatEigenvalue(row.mode.eigenvalue)}
              {row.pair ? <span className="ml-1 text-xs text-ink/70">(pair)</span> : null}
            </Td>
            <Td>{formatNumber(row.mode.magnitude)}</Td>
            <Td>{formatDuration(row.mode.timeConstantS)}</Td>
            <Td>{formatDuration(row.settlingS)}</Td>
            <Td className="whitespace-nowrap">
              {row.mode.periodSamples === null
                ? '—'
                : `${formatNumber(row.mode.periodSamples, 3)} samples (${formatDuration(row.periodS)})`}
            </Td>
            <Td>{formatNumber(row.mode.dampingRatio, 3)}</Td>
            <Td className="whitespace-nowrap">
              {row.mode.naturalFrequencyRadS === null ? '—' : `${formatNumber(row.mode.naturalFrequencyRadS, 3)} rad/s`}
            </Td>
            <Td>
              <Marks marks={row.marks} />
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
