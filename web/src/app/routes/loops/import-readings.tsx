import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/page-loading';
import { ImportReadings } from '../../../features/imports/components/import-readings';
import { loopQueryOptions } from '../../../features/loops/api/get-loop';

export function ImportReadingsPage() {
  const loopId = useParams().loopId ?? '';
  const loop = useQuery(loopQueryOptions(loopId));
  if (loop.isError) return <ErrorNotice error={loop.error} onRetry={() => void loop.refetch()} />;
  if (!loop.data) return <PageLoading />;
  return (
    <div>
      <PageHeader
        title={`Import readings · ${loop.data.tag}`}
        description="Load historical readings from a CSV file, for backtests and to fill gaps. The live twin never rewrites the past: imported readings are stored beside it."
        actions={
          <Link to={`/loops/${loop.data.id}`} className="text-sm underline">
            Back to {loop.data.tag}
          </Link>
        }
      />
      <ImportReadings loop={loop.data} />
    </div>
  );
}
