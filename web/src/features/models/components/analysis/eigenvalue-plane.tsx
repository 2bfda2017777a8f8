import { useState } from 'react';
import { formatNumber } from '../../../../lib/format-number';
import type { Mode } from '../../types';
import { isDivergent } from '../../utils/mode-facts';
import { describeModeText } from '../../utils/mode-text';
import { wholePlaneView, zoomedPlaneView, zoomHelps } from '../../utils/plane-view';

export type EigenvalueSet = { label: string; modes: Mode[]; hollow?: boolean };

const SIZE = 300;
const CENTRE = SIZE / 2;
const RADIUS = 125;

type EigenvaluePlaneProps = { sets: EigenvalueSet[]; samplePeriodS: number };

/** Eigenvalues in the complex plane with the unit circle; each point can be hovered or focused to read its mode. */
export function EigenvaluePlane({ sets, samplePeriodS }: EigenvaluePlaneProps) {
  const [active, setActive] = useState<{ set: number; mode: Mode } | null>(null);
  const [zoomed, setZoomed] = useState(false);
  const canZoom = zoomHelps(sets);
  const view = zoomed && canZoom ? zoomedPlaneView(sets) : wholePlaneView(sets);
  const toX = (re: number) => CENTRE + ((re - view.centreRe) / view.half) * RADIUS;
  const toY = (im: number) => CENTRE - ((im - view.centreIm) / view.half) * RADIUS;
  const label = (set: number) => (sets.length === 1 ? '' : `${sets[set].label}: `);

  return (
    <figure className="space-y-1">
      <svg
        viewBox={`0 0 ${SIZE} ${SIZE}`}
        className="w-full max-w-80 overflow-hidden rounded-sm border border-rule bg-panel"
        role="group"
        aria-label="Eigenvalues in the complex plane with the unit circle"
      >
        <line x1={0} x2={SIZE} y1={toY(0)} y2={toY(0)} stroke="var(--color-rule)" />
        <line y1={0} y2={SIZE} x1={toX(0)} x2={toX(0)} stroke="var(--color-rule)" />
        <circle
          cx={toX(0)}
          cy={toY(0)}
          r={RADIUS / view.half}
          fill="none"
          stroke="var(--color-ink)"
          strokeWidth={1.25}
        />
        {zoomed ? null : (
          <>
            <text x={toX(1) + 3} y={toY(0) - 4} fontSize={10} fill="var(--color-ink)">
              1
            </text>
            <text x={SIZE - 12} y={toY(0) - 4} fontSize={10} textAnchor="end" fill="var(--color-ink)">
              Re
            </text>
            <text x={toX(0) + 4} y={18} fontSize={10} fill="var(--color-ink)">
              Im
            </text>
          </>
        )}
        {sets.map((set, s) =>
          set.modes.map((mode, i) => {
            const x = toX(mode.eigenvalue.re);
            const y = toY(mode.eigenvalue.im);
            const colour = isDivergent(mode)
              ? 'var(--color-diverged)'
              : s === 0
                ? 'var(--color-ink)'
                : 'var(--color-twin)';
            const fill = set.hollow ? 'var(--color-panel)' : colour;
            const show = () => setActive({ set: s, mode });
            return (
              <g
                key={`${s}-${i}`}
                tabIndex={0}
                role="img"
                aria-label={`${label(s)}${describeModeText(mode, samplePeriodS)}`}
                onMouseEnter={show}
                onFocus={show}
                className="cursor-pointer focus:outline-none [&:focus>*]:stroke-[3]"
              >
                {isDivergent(mode) ? (
                  <rect x={x - 5} y={y - 5} width={10} height={10} fill={fill} stroke={colour} strokeWidth={1.5} />
                ) : (
                  <circle cx={x} cy={y} r={5} fill={fill} stroke={colour} strokeWidth={1.5} />
                )}
              </g>
            );
          }),
        )}
      </svg>
      <figcaption className="max-w-80 space-y-1 text-xs">
        <p className="min-h-8" aria-live="polite">
          {active
            ? `${label(active.set)}${describeModeText(active.mode, samplePeriodS)}`
            : 'Hover over or tab to a point to read its mode.'}
        </p>
        {zoomed && canZoom ? (
          <p>
            Showing Re {formatNumber(view.centreRe - view.half, 3)} to {formatNumber(view.centreRe + view.half, 3)}, Im{' '}
            {formatNumber(view.centreIm - view.half, 3)} to {formatNumber(view.centreIm + view.half, 3)}; the arc is the
            unit circle.
          </p>
        ) : null}
        {canZoom ? (
          <button
            type="button"
            className="font-medium underline focus-visible:outline-2 focus-visible:outline-twin"
            onClick={() => setZoomed(!zoomed)}
          >
            {zoomed ? 'Show the whole unit circle' : 'Zoom in on the eigenvalues'}
          </button>
        ) : null}
        <p className="text-ink/70">
          Round marks lie inside the unit circle and decay; square marks lie outside and grow.
          {sets.length > 1 ? ` Filled: ${sets[0].label}. Hollow: ${sets[1].label}.` : ''}
        </p>
      </figcaption>
    </figure>
  );
}
