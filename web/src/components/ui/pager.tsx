import { Button } from './button';

type PagerProps = {
  page: number;
  pageCount: number;
  summary: string;
  onPage: (page: number) => void;
};

export function Pager({ page, pageCount, summary, onPage }: PagerProps) {
  const lastPage = Math.max(1, pageCount);
  return (
    <div className="flex flex-wrap items-center justify-between gap-3 text-sm">
      <p className="tabular-nums" aria-live="polite">
        {summary}
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
