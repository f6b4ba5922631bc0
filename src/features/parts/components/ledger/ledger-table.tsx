import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type SortDirection } from '@tanstack/react-table';
import { useMemo } from 'react';
import { Link } from 'react-router';
import { Plate } from '../../../../components/ui/plate';
import { formatMinor } from '../../../../shared/money';
import type { LedgerQuery, PartLine } from '../../../../shared/schemas/parts';
import { KIND_LABELS, SOURCE_LABELS, STATUS_LABELS, STATUS_TONE } from '../../lib/labels';

type SortKey = LedgerQuery['sort'];
const col = createColumnHelper<PartLine>();

interface LedgerTableProps {
  lines: PartLine[];
  query: LedgerQuery;
  currency: string;
  systemName: (key: string | null) => string | null;
  /** The URL of this page sorted by `sort` in `dir` (back to page 1). */
  sortHref: (sort: SortKey, dir: 'asc' | 'desc') => string;
  editorHref: (episodeId: number) => string;
}

/**
 * One server page of the ledger. Sorting is the server's (TanStack Table in manual mode): a header
 * is a link that puts the sort in the URL, so the DOM never holds more than a page of rows.
 */
export function LedgerTable({ lines, query, currency, systemName, sortHref, editorHref }: LedgerTableProps) {
  const columns = useMemo(
    () => [
      col.accessor((l) => l.episode.number, {
        id: 'episode',
        header: 'Episode',
        cell: ({ row: { original: l } }) => (
          <Link to={editorHref(l.episodeId)} className="font-mono text-oxide-2 underline underline-offset-2">
            {l.episode.number}
            <span className="sr-only"> · {l.episode.title} (open in the editor)</span>
          </Link>
        ),
      }),
      col.accessor('description', {
        header: 'Part',
        cell: ({ row: { original: l } }) => (
          <>
            {l.description}
            {l.partNumber ? <span className="block font-mono text-[13px] text-slate">{l.partNumber}</span> : null}
          </>
        ),
      }),
      col.accessor((l) => l.supplier?.name ?? '', { id: 'supplier', header: 'Supplier' }),
      col.accessor('systemKey', {
        id: 'system',
        header: 'System',
        cell: ({ getValue }) => {
          const name = systemName(getValue());
          return name ? <Plate tone="oxide">{name}</Plate> : '—';
        },
      }),
      col.accessor('kind', { header: 'Kind', cell: ({ getValue }) => KIND_LABELS[getValue()] }),
      col.accessor('status', {
        header: 'Status',
        cell: ({ row: { original: l } }) => (
          <span className={`font-condensed text-xs font-semibold tracking-[0.1em] uppercase ${STATUS_TONE[l.status]}`}>
            {SOURCE_LABELS[l.source]} · {STATUS_LABELS[l.status]}
          </span>
        ),
      }),
      col.accessor((l) => l.buildAmounts?.grossMinor ?? null, {
        id: 'gross',
        header: `Total (${currency})`,
        cell: ({ row: { original: l } }) =>
          l.buildAmounts ? (
            <>
              {formatMinor(l.buildAmounts.grossMinor, currency)}
              {l.currency !== currency ? (
                <span className="block text-[13px] text-slate">{formatMinor(l.amounts.grossMinor, l.currency)}</span>
              ) : null}
            </>
          ) : (
            <span className="text-caution">no rate</span>
          ),
      }),
    ],
    [currency, systemName, editorHref],
  );
  const table = useReactTable({
    data: lines,
    columns,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualPagination: true,
    state: { sorting: [{ id: query.sort, desc: query.dir === 'desc' }] },
    getRowId: (l) => String(l.id),
  });

  // relative: the sr-only (absolute) labels inside must scroll with the table, not widen the page.
  return (
    <div className="relative overflow-x-auto">
      <table className="w-full min-w-[48rem] border-collapse text-[15px]">
        <caption className="sr-only">Part lines of the build, sorted by {query.sort}</caption>
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id} className="border-b-2 border-ink text-left">
              {group.headers.map((h) => {
                const sorted: false | SortDirection = h.column.getIsSorted();
                const numeric = h.column.id === 'gross';
                const next = sorted === 'asc' ? 'desc' : 'asc';
                return (
                  <th
                    key={h.id}
                    scope="col"
                    aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                    className={`py-2 pr-3 font-condensed text-[13px] font-semibold tracking-[0.1em] text-slate uppercase ${numeric ? 'text-right' : ''}`}
                  >
                    <Link
                      to={sortHref(h.column.id as SortKey, next)}
                      className="inline-flex min-h-11 items-center gap-1 text-slate no-underline hover:text-ink"
                    >
                      {flexRender(h.column.columnDef.header, h.getContext())}
                      <span aria-hidden="true">{sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : ''}</span>
                      <span className="sr-only">, sort {next === 'asc' ? 'ascending' : 'descending'}</span>
                    </Link>
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="border-b border-rule align-top">
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className={`py-2 pr-3 ${cell.column.id === 'gross' ? 'text-right font-mono whitespace-nowrap' : ''}`}>
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
