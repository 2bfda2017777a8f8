import type { RuleExpectation } from '@shadowloop/api/contracts';
import { formatDuration, formatSamples } from '../../../lib/format-number';

type RuleExpectationViewProps = {
  expectation: RuleExpectation | undefined;
  samplePeriodS: number;
  /** The settings have a problem, so no expectation can be given for them. */
  problem?: string | null;
  pending?: boolean;
};

/** The rule's expected false-alert interval (and detection delay) in a sentence and in numbers. */
export function RuleExpectationView({ expectation, samplePeriodS, problem, pending }: RuleExpectationViewProps) {
  return (
    <div
      aria-live="polite"
      aria-label="What to expect"
      role="region"
      className="rounded-sm border border-rule border-l-4 border-l-twin bg-paper px-3 py-2 text-sm"
    >
      {problem ? (
        <p>No expectation until the settings are fixed: {problem}</p>
      ) : !expectation ? (
        <p className="text-ink/70">
          {pending ? 'Working out what to expect…' : 'Fill in every setting, sigma too, to see what to expect.'}
        </p>
      ) : (
        <>
          <p className="font-medium">{expectation.sentence}</p>
          <p className="mt-1 text-xs tabular-nums text-ink/75">
            {expectation.falseAlertIntervalSamples !== null
              ? `Mean interval between false alerts: ${formatSamples(expectation.falseAlertIntervalSamples)} (${formatDuration(expectation.falseAlertIntervalSamples * samplePeriodS)}).`
              : null}
            {expectation.detectionDelaySamples !== null && expectation.shiftSigma !== null
              ? ` A shift of ${expectation.shiftSigma} standard deviations is found after ${formatSamples(expectation.detectionDelaySamples)} on average (${formatDuration(expectation.detectionDelaySamples * samplePeriodS)}).`
              : null}
          </p>
        </>
      )}
    </div>
  );
}
