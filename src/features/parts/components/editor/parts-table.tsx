import { createColumnHelper, flexRender, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { Fragment, memo, useMemo } from 'react';
import { Plate } from '../../../../components/ui/plate';
import { formatMinor } from '../../../../shared/money';
import type { PartLine } from '../../../../shared/schemas/parts';
import { SOURCE_LABELS, STATUS_LABELS, STATUS_TONE } from '../../lib/labels';
import { ReceiptControl } from './receipt-control';
import { SupportTag } from '../support-tag';

const col = createColumnHelper<PartLine>();
const th = 'py-2 pr-3 font-condensed text-[13px] font-semibold tracking-[0.1em] text-slate uppercase';

interface PartsTableProps {
  lines: PartLine[];
  systemName: (key: string | null) => string | null;
  editingId: number | null;
  /** The row being edited, in place of the line's cells. */
  renderEditor: (line: PartLine, index: number) => React.ReactNode;
  onEdit: (line: PartLine) => void;
  onDelete: (line: PartLine) => void;
  busyId: number | null;
}

/** The saved lines as text (light DOM); only the line being edited has inputs. Memoised: typing in a row must not re-render the rest. */
export const PartsTable = memo(function PartsTable({
  lines,
  systemName,
  editingId,
  renderEditor,
  onEdit,
  onDelete,
  busyId,
}: PartsTableProps) {
  const columns = useMemo(
    () => [
      col.accessor('description', {
        header: 'Part',
        cell: ({ row: { original: l } }) => (
          <>
            <span className="text-ink">{l.description}</span>
            {l.partNumber || l.supplier ? (
              <span className="block font-mono text-[13px] text-slate">{[l.supplier?.name, l.partNumber].filter(Boolean).join(' · ')}</span>
            ) : null}
          </>
        ),
      }),
      col.accessor('systemKey', {
        header: 'System',
        cell: ({ getValue }) => {
          const name = systemName(getValue());
          return name ? <Plate tone="oxide">{name}</Plate> : <span className="text-slate">—</span>;
        },
      }),
      col.accessor('status', {
        header: 'Source',
        cell: ({ row: { original: l } }) => (
          <span className={`font-condensed text-xs font-semibold tracking-[0.1em] uppercase ${STATUS_TONE[l.status]}`}>
            {SOURCE_LABELS[l.source]} · {STATUS_LABELS[l.status]}
          </span>
        ),
      }),
      col.accessor('supportKind', {
        header: 'Support',
        cell: ({ row: { original: l } }) => <SupportTag line={l} team />,
      }),
      col.accessor('quantity', {
        header: 'Qty',
        meta: { numeric: true },
        cell: ({ row: { original: l } }) => `${l.quantity}${l.unit === 'each' ? '' : ` ${l.unit}`}`,
      }),
      col.accessor('unitPriceMinor', {
        header: 'Unit',
        meta: { numeric: true },
        cell: ({ row: { original: l } }) => formatMinor(l.unitPriceMinor, l.currency),
      }),
      col.accessor((l) => l.amounts.grossMinor, {
        id: 'total',
        header: 'Total',
        meta: { numeric: true },
        cell: ({ row: { original: l } }) => formatMinor(l.amounts.grossMinor, l.currency),
      }),
    ],
    [systemName],
  );
  const table = useReactTable({ data: lines, columns, getCoreRowModel: getCoreRowModel(), getRowId: (l) => String(l.id) });
  const span = columns.length + 1;

  // relative: the sr-only (absolute) labels inside must scroll with the table, not widen the page.
  return (
    <div className="relative overflow-x-auto">
      <table className="w-full min-w-[40rem] border-collapse text-[15px]">
        <caption className="sr-only">Part lines of this episode</caption>
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id} className="border-b-2 border-ink text-left">
              {group.headers.map((h) => (
                <th key={h.id} scope="col" className={`${th} ${isNumeric(h.column.columnDef.meta) ? 'text-right' : ''}`}>
                  {flexRender(h.column.columnDef.header, h.getContext())}
                </th>
              ))}
              <th scope="col" className={`${th} text-right`}>
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row, index) => (
            <Fragment key={row.id}>
              {row.original.id === editingId ? (
                <tr className="border-b border-rule bg-paper-2">
                  <td colSpan={span} className="p-3">
                    {renderEditor(row.original, index)}
                  </td>
                </tr>
              ) : (
                <tr className="border-b border-rule align-top">
                  {row.getVisibleCells().map((cell) => (
                    <td
                      key={cell.id}
                      className={`py-2 pr-3 ${isNumeric(cell.column.columnDef.meta) ? 'text-right font-mono whitespace-nowrap' : ''}`}
                    >
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ))}
                  <td className="py-1 text-right whitespace-nowrap">
                    <ReceiptControl line={row.original} />
                    <button type="button" className={actionClass} onClick={() => onEdit(row.original)}>
                      Edit
                      <span className="sr-only">
                        {' '}
                        line {index + 1}: {row.original.description}
                      </span>
                    </button>
                    <button
                      type="button"
                      className={`${actionClass} text-oxide-2`}
                      disabled={busyId === row.original.id}
                      onClick={() => onDelete(row.original)}
                    >
                      Delete
                      <span className="sr-only">
                        {' '}
                        line {index + 1}: {row.original.description}
                      </span>
                    </button>
                  </td>
                </tr>
              )}
            </Fragment>
          ))}
        </tbody>
      </table>
    </div>
  );
});

const actionClass =
  'min-h-11 px-2 font-condensed text-sm font-semibold tracking-label uppercase underline underline-offset-2 disabled:opacity-60';

function isNumeric(meta: unknown): boolean {
  return typeof meta === 'object' && meta !== null && 'numeric' in meta && meta.numeric === true;
}
