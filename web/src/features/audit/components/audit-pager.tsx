import { Pager } from '../../../components/ui/pager';

type AuditPagerProps = {
  offset: number;
  limit: number;
  shown: number;
  total: number;
  loading: boolean;
  onPage: (page: number) => void;
};

/** The shared pager, counting audit entries by offset and limit. */
export function AuditPager({ offset, limit, shown, total, loading, onPage }: AuditPagerProps) {
  const summary = loading
    ? 'Loading entries…'
    : shown === 0
      ? 'No entries'
      : `Entries ${offset + 1}–${offset + shown} of ${total}`;
  return (
    <Pager
      page={Math.floor(offset / limit) + 1}
      pageCount={Math.ceil(total / limit)}
      summary={summary}
      onPage={onPage}
    />
  );
}
