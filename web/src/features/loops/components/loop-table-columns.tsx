import type { ColumnDef } from '@tanstack/react-table';
import { Link } from 'react-router';
import { plural } from '../../../lib/format-number';
import type { Loop } from '../api/get-loops';
import { TRACKING_STATUS_ORDER } from '../utils/loop-table-search';
import { TrackingStatusWord } from './tracking-status-word';

function describeSignals(loop: Loop): string {
  return `${plural(loop.inputs.length, 'input')} · ${plural(loop.states.length, 'state')} · ${plural(loop.outputs.length, 'output')}`;
}

export const LOOP_COLUMNS: ColumnDef<Loop>[] = [
  {
    id: 'tag',
    accessorKey: 'tag',
    header: 'Tag',
    cell: ({ row }) => (
      <Link to={`/loops/${row.original.id}`} className="font-bold underline-offset-2 hover:underline">
        {row.original.tag}
      </Link>
    ),
  },
  { id: 'name', accessorKey: 'name', header: 'Name' },
  {
    id: 'area',
    accessorFn: (loop) => loop.areaName,
    header: 'Area',
    filterFn: (row, _columnId, area: string) => row.original.area === area,
  },
  {
    id: 'samplePeriodS',
    accessorKey: 'samplePeriodS',
    header: 'Sample period',
    cell: ({ row }) => <span className="tabular-nums">{row.original.samplePeriodS} s</span>,
  },
  { id: 'signals', header: 'Signals', enableSorting: false, cell: ({ row }) => describeSignals(row.original) },
  {
    id: 'status',
    accessorKey: 'status',
    header: 'Tracking status',
    sortingFn: (a, b) =>
      TRACKING_STATUS_ORDER.indexOf(a.original.status) - TRACKING_STATUS_ORDER.indexOf(b.original.status),
    filterFn: (row, _columnId, status: string) => row.original.status === status,
    cell: ({ row }) => <TrackingStatusWord status={row.original.status} />,
  },
  {
    id: 'twin',
    accessorFn: (loop) => loop.activeVersionNumber ?? -1,
    header: 'Twin model',
    cell: ({ row }) =>
      row.original.activeVersionNumber === null ? (
        <span className="text-ink/70">none active</span>
      ) : (
        <span className="tabular-nums">version {row.original.activeVersionNumber}</span>
      ),
  },
];

/** Tag and name, for the free-text filter. */
export function loopMatchesText(loop: Loop, text: string): boolean {
  const needle = text.trim().toLowerCase();
  return needle === '' || loop.tag.toLowerCase().includes(needle) || loop.name.toLowerCase().includes(needle);
}
