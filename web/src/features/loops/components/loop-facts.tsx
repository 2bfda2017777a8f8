import type { Loop } from '../api/get-loops';
import { TrackingStatusWord } from './tracking-status-word';

/** The one line under a loop's title: where it is, how often it samples, how its twin is doing. */
export function LoopFacts({ loop }: { loop: Loop }) {
  return (
    <span className="flex flex-wrap items-center gap-x-3 gap-y-1">
      <span>{loop.areaName}</span>
      <span className="tabular-nums">sample period {loop.samplePeriodS} s</span>
      <span>
        {count(loop.inputs.length, 'input')} · {count(loop.states.length, 'state')} ·{' '}
        {count(loop.outputs.length, 'output')}
      </span>
      <span>time zone {loop.timeZone}</span>
      <span className="inline-flex items-center gap-1">
        tracking: <TrackingStatusWord status={loop.status} />
      </span>
    </span>
  );
}

const count = (n: number, noun: string) => `${n} ${noun}${n === 1 ? '' : 's'}`;
