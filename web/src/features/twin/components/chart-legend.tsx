export type LegendMark = 'measured' | 'predicted' | 'band' | 'forecast' | 'preview' | { colour: string };

export type LegendItem = { label: string; mark: LegendMark };

const TWIN = 'var(--color-twin)';

function Swatch({ mark }: { mark: LegendMark }) {
  if (mark === 'band')
    return <rect x="0" y="2" width="24" height="8" fill={TWIN} fillOpacity="0.12" stroke={TWIN} strokeOpacity="0.3" />;
  const style =
    typeof mark === 'object'
      ? { stroke: mark.colour, dash: undefined, width: 2 }
      : {
          measured: { stroke: 'var(--color-ink)', dash: undefined, width: 2 },
          predicted: { stroke: TWIN, dash: '6 4', width: 1.75 },
          forecast: { stroke: TWIN, dash: '2 3', width: 2.25 },
          preview: { stroke: TWIN, dash: '10 4', width: 2.75 },
        }[mark];
  return (
    <line x1="0" y1="6" x2="24" y2="6" stroke={style.stroke} strokeWidth={style.width} strokeDasharray={style.dash} />
  );
}

/** The chart's key in words, drawn with the same strokes as the lines. */
export function ChartLegend({ items }: { items: readonly LegendItem[] }) {
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink/85">
      {items.map((item) => (
        <li key={item.label} className="inline-flex items-center gap-1.5">
          <svg width="24" height="12" aria-hidden="true" focusable="false">
            <Swatch mark={item.mark} />
          </svg>
          {item.label}
        </li>
      ))}
    </ul>
  );
}
