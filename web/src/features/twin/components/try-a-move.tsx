import { useEffect, useState, type FormEvent } from 'react';
import { describeError } from '../../../components/errors/describe-error';
import { Button } from '../../../components/ui/button';
import { INPUT_CLASSES } from '../../../components/ui/field';
import { MOVE_PREVIEW_CAUTION } from '../../../config/product';
import { formatNumber } from '../../../lib/format-number';
import { parseCellNumber } from '../../../lib/parse-number';
import type { Loop } from '../../loops/api/get-loops';
import { FORECAST_SAMPLES } from '../api/get-forecast';
import { usePreviewMove, type MovePreview } from '../api/preview-move';
import { overlayOf } from '../utils/chart-data';
import type { LiveTrend } from '../utils/live-trend';

const signed = (value: number, unit: string) =>
  `${value > 0 ? '+' : ''}${formatNumber(value, 3)}${unit ? ` ${unit}` : ''}`;

function PreviewOutcome({ loop, preview }: { loop: Loop; preview: MovePreview }) {
  const input = loop.inputs[preview.inputIndex];
  return (
    <div className="space-y-0.5 tabular-nums">
      <p className="font-medium">
        A step of {signed(preview.delta, input?.unit ?? '')} in {input?.name ?? 'the input'}, after {FORECAST_SAMPLES}{' '}
        samples:
      </p>
      <ul className="space-y-0.5">
        {loop.outputs.map((s, i) => {
          const moved = preview.y[i]?.at(-1) ?? NaN;
          const held = preview.baseline.y[i]?.at(-1) ?? NaN;
          return (
            <li key={s.name}>
              <span className="font-medium">{s.name}</span>: {formatNumber(moved)} {s.unit} with the move,{' '}
              {formatNumber(held)} {s.unit} held ({signed(moved - held, s.unit)})
            </li>
          );
        })}
      </ul>
    </div>
  );
}

/** A what-if step in one input, previewed by the model and drawn into the charts; never sent anywhere. */
export function TryAMove({
  loop,
  trend,
  onShown,
}: {
  loop: Loop;
  trend: LiveTrend;
  onShown: (shown: boolean) => void;
}) {
  const [inputIndex, setInputIndex] = useState(0);
  const [step, setStep] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const preview = usePreviewMove(loop.id);
  const shown = preview.data;
  useEffect(() => {
    trend.setOverlays({ preview: shown ? overlayOf(shown) : null });
    onShown(Boolean(shown));
  }, [trend, shown, onShown]);
  const unit = loop.inputs[inputIndex]?.unit ?? '';

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const delta = parseCellNumber(step);
    if (delta === null || delta === undefined || delta === 0)
      return setProblem(`Enter a step size in ${unit || 'the input’s unit'}, e.g. 5 or −2.5.`);
    setProblem(null);
    preview.mutate({ inputIndex, delta });
  };

  return (
    <section aria-label="Try a move" className="space-y-2 rounded-sm border border-rule bg-panel px-3 py-2 text-sm">
      <h2 className="font-bold">Try a move</h2>
      <form onSubmit={submit} className="space-y-2">
        <label className="flex flex-col gap-1">
          <span className="font-medium">Input</span>
          <select value={inputIndex} onChange={(e) => setInputIndex(Number(e.target.value))} className={INPUT_CLASSES}>
            {loop.inputs.map((s, i) => (
              <option key={s.name} value={i}>
                {s.name}
                {s.unit ? ` (${s.unit})` : ''}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1">
          <span className="font-medium">Step added to the input{unit ? ` (${unit})` : ''}</span>
          <input
            value={step}
            onChange={(e) => setStep(e.target.value)}
            inputMode="decimal"
            placeholder="e.g. 5 to raise it, -5 to lower it"
            aria-invalid={problem ? true : undefined}
            className={INPUT_CLASSES}
          />
        </label>
        {problem ? (
          <p role="alert" className="text-xs font-medium text-diverged">
            {problem}
          </p>
        ) : null}
        <div className="flex gap-2">
          <Button type="submit" variant="primary" disabled={preview.isPending || loop.activeVersionId === null}>
            Preview the move
          </Button>
          {shown ? (
            <Button variant="quiet" onClick={() => preview.reset()}>
              Clear preview
            </Button>
          ) : null}
        </div>
      </form>
      {preview.isError ? (
        <p role="alert" className="text-diverged">
          {describeError(preview.error).explanation}
        </p>
      ) : null}
      {shown ? <PreviewOutcome loop={loop} preview={shown} /> : null}
      <p role="note" className="rounded-sm border-l-4 border-l-drifting bg-paper px-2 py-1.5 text-xs">
        {MOVE_PREVIEW_CAUTION}
      </p>
    </section>
  );
}
