import { formatNumber } from '../../../../lib/format-number';
import type { Direction } from '../../utils/phase-plane';
import { phaseExtent } from '../../utils/phase-plane';

const SIZE = 300;
const C = SIZE / 2;
const R = 130;

type PhasePlaneProps = { trajectory: number[][]; directions: Direction[]; xLabel: string; yLabel: string };

/** The two states against each other: the free response from x0 and the eigenvector directions it follows. */
export function PhasePlane({ trajectory, directions, xLabel, yLabel }: PhasePlaneProps) {
  const [ex, ey] = phaseExtent(trajectory);
  const toX = (v: number) => C + (v / ex) * R;
  const toY = (v: number) => C - (v / ey) * R;
  const points = trajectory.map((x) => `${toX(x[0]).toFixed(1)},${toY(x[1]).toFixed(1)}`).join(' ');
  const start = trajectory[0];
  const reach = Math.hypot(ex, ey) * 2;
  return (
    <figure className="space-y-1">
      <figcaption className="text-sm font-bold">Phase plane</figcaption>
      <svg
        viewBox={`0 0 ${SIZE} ${SIZE}`}
        className="w-full max-w-80 rounded-sm border border-rule bg-panel"
        role="img"
        aria-label={`Phase plane of ${xLabel} against ${yLabel}: the free response from x0 = (${formatNumber(start[0])}, ${formatNumber(start[1])}) and ${directions.length} eigenvector direction${directions.length === 1 ? '' : 's'}`}
      >
        <defs>
          <clipPath id="phase-area">
            <rect x={0} y={0} width={SIZE} height={SIZE} />
          </clipPath>
        </defs>
        <line x1={8} x2={SIZE - 8} y1={C} y2={C} stroke="var(--color-rule)" />
        <line y1={8} y2={SIZE - 8} x1={C} x2={C} stroke="var(--color-rule)" />
        <g clipPath="url(#phase-area)">
          {directions.map((d, i) => (
            <g key={d.label}>
              <line
                x1={toX(-d.dx * reach)}
                y1={toY(-d.dy * reach)}
                x2={toX(d.dx * reach)}
                y2={toY(d.dy * reach)}
                stroke="var(--color-twin)"
                strokeDasharray="5 4"
                strokeWidth={1.25}
              />
              <text
                x={Math.min(SIZE - 60, Math.max(4, toX(d.dx * ex * 0.8)))}
                y={Math.min(SIZE - 6, Math.max(12, toY(d.dy * ey * 0.8) - 4 - i * 12))}
                fontSize={10}
                fill="var(--color-twin)"
              >
                {d.label}
              </text>
            </g>
          ))}
        </g>
        <polyline points={points} fill="none" stroke="var(--color-ink)" strokeWidth={1.5} />
        <circle cx={toX(start[0])} cy={toY(start[1])} r={4} fill="var(--color-ink)" />
        <text x={toX(start[0]) + 6} y={toY(start[1]) - 6} fontSize={10} fill="var(--color-ink)">
          x0
        </text>
        <text x={SIZE - 8} y={C + 14} fontSize={10} textAnchor="end" fill="var(--color-ink)">
          {xLabel}
        </text>
        <text x={C + 6} y={14} fontSize={10} fill="var(--color-ink)">
          {yLabel}
        </text>
      </svg>
      <p className="max-w-80 text-xs text-ink/70">
        Solid: the free response, starting at the dot. Dashed: eigenvector directions of the real eigenvalues; a state
        on one of them stays on it and shrinks by that eigenvalue every sample.
      </p>
    </figure>
  );
}
