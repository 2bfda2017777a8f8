import type { Header } from '@tanstack/react-table';
import { flexRender } from '@tanstack/react-table';
import { Th } from './table';

const SORT_WORDS = { asc: 'ascending', desc: 'descending' } as const;

/** A column heading that sorts on click and says its order to screen readers and in a small arrow. */
export function SortableHeader<TData>({ header }: { header: Header<TData, unknown> }) {
  const label = flexRender(header.column.columnDef.header, header.getContext());
  if (!header.column.getCanSort()) return <Th>{label}</Th>;
  const sorted = header.column.getIsSorted();
  return (
    <Th aria-sort={sorted ? SORT_WORDS[sorted] : 'none'}>
      <button
        type="button"
        onClick={header.column.getToggleSortingHandler()}
        className="inline-flex items-center gap-1 uppercase hover:underline"
      >
        {label}
        <span aria-hidden="true" className="w-3 text-ink/60">
          {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
        </span>
      </button>
    </Th>
  );
}
