import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnFiltersState,
  type SortingState,
} from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { Pager } from '../../../components/ui/pager';
import { SortableHeader } from '../../../components/ui/sortable-header';
import { SkeletonRows, Table, Td } from '../../../components/ui/table';
import type { Loop } from '../api/get-loops';
import type { LoopTableSearch } from '../utils/loop-table-search';
import { LOOP_COLUMNS, loopMatchesText } from './loop-table-columns';

export const LOOPS_PER_PAGE = 25;

type LoopsTableProps = {
  loops: Loop[] | undefined;
  search: LoopTableSearch;
  onPage: (page: number) => void;
};

export function LoopsTable({ loops, search, onPage }: LoopsTableProps) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'tag', desc: false }]);
  const columnFilters = useMemo<ColumnFiltersState>(
    () => [
      ...(search.area ? [{ id: 'area', value: search.area }] : []),
      ...(search.status ? [{ id: 'status', value: search.status }] : []),
    ],
    [search.area, search.status],
  );
  const data = useMemo(() => (loops ?? []).filter((loop) => loopMatchesText(loop, search.text)), [loops, search.text]);
  // eslint-disable-next-line react-hooks/incompatible-library -- the app does not use the React Compiler; the table re-renders with its props
  const table = useReactTable({
    data,
    columns: LOOP_COLUMNS,
    state: { sorting, columnFilters, pagination: { pageIndex: search.page - 1, pageSize: LOOPS_PER_PAGE } },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
    autoResetPageIndex: false,
  });
  const rows = table.getRowModel().rows;
  const matching = table.getFilteredRowModel().rows.length;
  const first = (search.page - 1) * LOOPS_PER_PAGE;
  const filtered = columnFilters.length > 0 || search.text !== '';

  return (
    <div className="space-y-2">
      <Table caption="Registered loops">
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => (
                <SortableHeader key={header.id} header={header} />
              ))}
            </tr>
          ))}
        </thead>
        <tbody>
          {loops === undefined ? <SkeletonRows columns={LOOP_COLUMNS.length} rows={6} /> : null}
          {loops !== undefined && rows.length === 0 ? (
            <tr>
              <Td colSpan={LOOP_COLUMNS.length} className="py-4 text-ink/75">
                {filtered
                  ? 'No loop matches these filters. Clear a filter to see more loops.'
                  : 'No loops are registered yet.'}
              </Td>
            </tr>
          ) : null}
          {rows.map((row) => (
            <tr key={row.id} className="hover:bg-paper">
              {row.getVisibleCells().map((cell) => (
                <Td key={cell.id}>{flexRender(cell.column.columnDef.cell, cell.getContext())}</Td>
              ))}
            </tr>
          ))}
        </tbody>
      </Table>
      <Pager
        page={search.page}
        pageCount={table.getPageCount()}
        summary={
          loops === undefined
            ? 'Loading loops…'
            : matching === 0
              ? 'No loops'
              : `Loops ${first + 1}–${first + rows.length} of ${matching}`
        }
        onPage={onPage}
      />
    </div>
  );
}
