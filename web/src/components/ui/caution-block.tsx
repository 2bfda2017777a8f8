import { ADVISORY_CAUTION } from '../../config/product';

export function CautionBlock({ heading = 'Caution' }: { heading?: string }) {
  return (
    <section
      aria-label={heading}
      className="rounded-sm border border-drifting/60 border-l-4 border-l-drifting bg-panel px-4 py-3 text-sm"
    >
      <h2 className="font-bold">{heading}</h2>
      {ADVISORY_CAUTION.map((sentence) => (
        <p key={sentence} className="mt-1">
          {sentence}
        </p>
      ))}
    </section>
  );
}
