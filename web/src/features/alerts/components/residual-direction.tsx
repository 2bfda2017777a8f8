import type { ResidualDirection as Direction } from '@shadowloop/api/contracts';
import { StatusWord } from '../../../components/ui/status-word';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatEigenvalue, formatNumber } from '../../../lib/format-number';
import { ShareBar } from './share-bar';

const POINTS_WORDS = {
  sensor: { tone: 'drifting', label: 'points to a sensor' },
  process: { tone: 'diverged', label: 'points to the process' },
  unclear: { tone: 'stale', label: 'no clear direction' },
} as const;

function SignalShares({ signals }: { signals: Direction['signals'] }) {
  return (
    <Table caption="Which outputs carry the residual">
      <thead>
        <tr>
          <Th>Output</Th>
          <Th>Share of the residual</Th>
          <Th>Residual</Th>
        </tr>
      </thead>
      <tbody className="tabular-nums">
        {signals.map((signal) => (
          <tr key={signal.index}>
            <Td>{signal.name}</Td>
            <Td>
              <ShareBar share={signal.share} />
            </Td>
            <Td>
              {formatNumber(signal.residual)} {signal.unit}
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

function ModeShares({ modes }: { modes: Direction['modes'] }) {
  return (
    <Table caption="How the residual projects onto the model's modes">
      <thead>
        <tr>
          <Th>Mode (eigenvalue λ)</Th>
          <Th>Share of the residual</Th>
        </tr>
      </thead>
      <tbody className="tabular-nums">
        {modes.map((mode, i) => (
          <tr key={i}>
            <Td>λ = {formatEigenvalue(mode.eigenvalue)}</Td>
            <Td>
              <ShareBar share={mode.share} />
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

/** The hint: which signals carry the residual and along which modes, and what that points to. */
export function ResidualDirection({ direction }: { direction: Direction | null }) {
  if (!direction) {
    return (
      <p className="text-sm text-ink/80">
        This alert has no residual direction: stale readings and an unstable model leave no residual to split.
      </p>
    );
  }
  const points = POINTS_WORDS[direction.points];
  return (
    <div className="space-y-3">
      <p className="flex flex-wrap items-center gap-3 text-sm">
        <StatusWord tone={points.tone} label={points.label} />
        <span className="font-medium">{direction.hint}</span>
      </p>
      <div className="grid items-start gap-4 lg:grid-cols-2">
        <SignalShares signals={direction.signals} />
        {direction.modes.length ? <ModeShares modes={direction.modes} /> : null}
      </div>
    </div>
  );
}
