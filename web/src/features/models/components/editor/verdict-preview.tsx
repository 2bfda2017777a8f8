import { useQuery } from '@tanstack/react-query';
import { describeError } from '../../../../components/errors/describe-error';
import { useDebouncedValue } from '../../../../lib/use-debounced-value';
import { previewAnalysisQueryOptions, type AnalysisRequest } from '../../api/preview-analysis';
import { buildVerdict } from '../../utils/verdict';
import { VerdictBanner } from '../verdict-banner';

const PREVIEW_DELAY_MS = 600;

type VerdictPreviewProps = { request: AnalysisRequest | null; continuous: boolean };

/** The verdict on the matrices as they stand, refreshed a moment after the typing stops. */
export function VerdictPreview({ request, continuous }: VerdictPreviewProps) {
  const settledKey = useDebouncedValue(request ? JSON.stringify(request) : null, PREVIEW_DELAY_MS);
  const settled = settledKey ? (JSON.parse(settledKey) as AnalysisRequest) : null;
  const preview = useQuery(previewAnalysisQueryOptions(settled));

  let body;
  if (continuous) {
    body = (
      <p>
        A continuous model is sampled with a zero-order hold when it is saved; its verdict appears on the saved version.
      </p>
    );
  } else if (!request) {
    body = <p>The verdict appears here as soon as every cell of A and B (and of C and D when given) holds a number.</p>;
  } else if (preview.isError) {
    body = <p className="text-diverged">{describeError(preview.error).explanation}</p>;
  } else if (preview.data && settled) {
    body = <VerdictBanner compact verdict={buildVerdict(preview.data, settled.samplePeriodS)} />;
  } else {
    body = <p className="text-ink/70">Working out the verdict…</p>;
  }
  return (
    <section aria-label="Verdict preview" aria-busy={preview.isFetching} className="space-y-1 text-sm">
      <h2 className="font-bold">Verdict preview</h2>
      <div aria-live="polite">{body}</div>
    </section>
  );
}
