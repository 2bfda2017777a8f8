import type { Verdict } from '../utils/verdict';

const BAND: Record<Verdict['stability'], string> = {
  stable: 'border-l-in-step',
  marginal: 'border-l-drifting',
  unstable: 'border-l-diverged',
};

/** The verdict in words first; the band's colour only repeats what the first word says. */
export function VerdictBanner({ verdict, compact = false }: { verdict: Verdict; compact?: boolean }) {
  return (
    <section
      aria-label="Verdict"
      className={`rounded-sm border border-rule border-l-4 bg-panel ${compact ? 'px-3 py-2' : 'px-4 py-3'} ${BAND[verdict.stability]}`}
    >
      <p className={compact ? 'text-sm' : 'text-base'}>
        <strong>{verdict.headline}.</strong> {verdict.sentence}
      </p>
      {verdict.notes.map((note) => (
        <p key={note} className="mt-1 text-sm">
          {note}
        </p>
      ))}
    </section>
  );
}
