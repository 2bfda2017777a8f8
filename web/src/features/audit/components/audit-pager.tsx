import { Button } from '../../../components/ui/button';

type AuditPagerProps = {
  offset: number;
  limit: number;
  shown: number;
  total: number;
  loading: boolean;
  onPage: (page: number) => void;
};

export function AuditPager({ offset, limit, shown, total, loading, onPage }: AuditPagerProps) {
  const page = Math.floor(offset / limit) + 1;
  const lastPage = Math.max(1, Math.ceil(total / limit));
  const range = loading
    ? 'Loading entries…'
    : shown === 0
      ? 'No entries'
      : `Entries ${offset + 1}–${offset + shown} of ${total}`;
  return (
    <div className="flex items-center justify-between gap-3 text-sm">
      <p className="tabular-nums" aria-live="polite">
        {range}
      </p>
      <div className="flex items-center gap-2">
        <Button disabled={page <= 1} onClick={() => onPage(page - 1)}>
          Previous page
        </Button>
        <span className="tabular-nums">
          Page {page} of {lastPage}
        </span>
        <Button disabled={page >= lastPage} onClick={() => onPage(page + 1)}>
          Next page
        </Button>
      </div>
    </div>
  );
}
