export type StatusTone = 'in_step' | 'drifting' | 'diverged' | 'stale' | 'twin' | 'ready' | 'none';

const DOT_CLASSES: Record<StatusTone, string> = {
  in_step: 'bg-in-step',
  drifting: 'bg-drifting',
  diverged: 'bg-diverged',
  stale: 'bg-stale',
  twin: 'bg-twin',
  ready: 'border-2 border-in-step bg-panel',
  none: 'border-2 border-stale bg-panel',
};

type StatusWordProps = {
  tone: StatusTone;
  label: string;
};

/** Status is never shown by colour alone: the word always sits beside the dot. */
export function StatusWord({ tone, label }: StatusWordProps) {
  return (
    <span className="inline-flex items-center gap-1.5 whitespace-nowrap">
      <span aria-hidden="true" className={`inline-block size-2.5 rounded-full ${DOT_CLASSES[tone]}`} />
      <span>{label}</span>
    </span>
  );
}
