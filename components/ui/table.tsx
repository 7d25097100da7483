'use client';

import {
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type CellContext,
  type ColumnDef,
  type HeaderContext,
  type OnChangeFn,
  type Row,
  type RowData,
  type SortingState,
} from '@tanstack/react-table';
import { useState, type HTMLAttributes, type ReactNode } from 'react';
import { cx } from './cx';

declare module '@tanstack/react-table' {
  // Module augmentation has to be an interface; both type parameters are required by the original.
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface ColumnMeta<TData extends RowData, TValue> {
    /** The label beside the value in the card layout (under 640 px); defaults to the header text. */
    cardLabel?: string;
    /** `title`: the card's heading, no label; `hidden`: left out of the card. */
    card?: 'title' | 'hidden';
    align?: 'left' | 'right';
    /** Extra classes of this column's cells (not its header). */
    className?: string;
    /** The first cell of a row names it (rendered as a row header). */
    rowHeader?: boolean;
  }
}

export type { ColumnDef, SortingState } from '@tanstack/react-table';

// Cells and headers are called as plain functions, not mounted as components: columns may be
// rebuilt on every render (closing over the screen's state) without remounting the inputs in them.
function renderHeader<T>(def: ColumnDef<T, unknown>, ctx: HeaderContext<T, unknown>): ReactNode {
  const h = def.header;
  return typeof h === 'function' ? (h(ctx) as ReactNode) : (h ?? null);
}
function renderCell<T>(def: ColumnDef<T, unknown>, ctx: CellContext<T, unknown>): ReactNode {
  const c = def.cell;
  if (typeof c === 'function') return c(ctx) as ReactNode;
  if (c !== undefined) return c;
  const v = ctx.getValue();
  return typeof v === 'string' || typeof v === 'number' ? v : null;
}
const headerText = <T,>(def: ColumnDef<T, unknown>) =>
  def.meta?.cardLabel ?? (typeof def.header === 'string' ? def.header : '');

type RowProps = HTMLAttributes<HTMLTableRowElement> & { 'data-testid'?: string };

/**
 * A data table on @tanstack/react-table: sortable headers (aria-sort, a button per header),
 * column sizes from `size` in the column definitions, a header that stays in view while the page
 * scrolls (from 1024 px, where the table is not in a sideways-scrolling box), and under 640 px a
 * card per row with "label: value" lines. Sorting is done here unless `manualSorting` (the server
 * sorts; then pass `sorting` and `onSortingChange`).
 */
export function Table<T>({
  data,
  columns,
  label,
  getRowId,
  rowProps,
  empty,
  sorting: sortingProp,
  onSortingChange,
  manualSorting = false,
  enableSorting = true,
  busy = false,
  wide = false,
  framed = true,
  density = 'normal',
  className,
  tableClassName,
}: {
  data: T[];
  // Column value types differ per column; tanstack's own helpers type them as `any` as well.
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  columns: ColumnDef<T, any>[];
  /** The table's accessible name. */
  label: string;
  getRowId?: (row: T, index: number) => string;
  rowProps?: (row: T) => RowProps;
  empty?: ReactNode;
  sorting?: SortingState;
  onSortingChange?: OnChangeFn<SortingState>;
  manualSorting?: boolean;
  enableSorting?: boolean;
  busy?: boolean;
  /**
   * The table may be wider than its box (set a minimum width in `tableClassName`): from 640 px
   * the box scrolls sideways and is a named stop in the tab order, so a keyboard can scroll it.
   */
  wide?: boolean;
  /**
   * Draw the table in a panel from 640 px, and under it each row as a card of its own. Unframed
   * (the table already sits in a Panel), the rows under 640 px are separated by rules instead.
   */
  framed?: boolean;
  density?: 'normal' | 'dense';
  className?: string;
  /** Classes of the <table> itself, e.g. a minimum width from 640 px: `sm:min-w-[860px]`. */
  tableClassName?: string;
}) {
  const [ownSorting, setOwnSorting] = useState<SortingState>([]);
  const sorting = sortingProp ?? ownSorting;
  const table = useReactTable<T>({
    data,
    columns,
    getRowId,
    state: { sorting },
    onSortingChange: onSortingChange ?? setOwnSorting,
    manualSorting,
    enableSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: manualSorting ? undefined : getSortedRowModel(),
  });
  const pad = density === 'dense' ? 'px-2 py-1' : 'px-3 py-2';
  const sized = columns.some((c) => c.size !== undefined);
  const rows = table.getRowModel().rows;
  const leafCount = table.getVisibleLeafColumns().length;

  const cellsOf = (row: Row<T>) =>
    row.getVisibleCells().map((cell, i) => {
      const def = cell.column.columnDef;
      const meta = def.meta ?? {};
      const content = renderCell(def, cell.getContext());
      // Nothing to show: no "label:" line with an empty value in the card layout.
      const blank =
        content === null ||
        content === undefined ||
        content === '' ||
        content === false ||
        (Array.isArray(content) && content.every((x) => x === null || x === undefined || x === false || x === ''));
      const isRowHeader = i === 0 && meta.rowHeader;
      const Tag = isRowHeader ? 'th' : 'td';
      const text = headerText(def);
      return (
        <Tag
          key={cell.id}
          role={isRowHeader ? 'rowheader' : 'cell'}
          scope={isRowHeader ? 'row' : undefined}
          className={cx(
            'align-top font-normal sm:table-cell',
            pad,
            meta.align === 'right' ? 'sm:text-right' : 'text-left',
            meta.card === 'hidden' || blank ? 'max-sm:hidden' : 'max-sm:flex max-sm:gap-x-2 max-sm:px-0 max-sm:py-0.5',
            meta.card === 'title' && 'max-sm:order-first max-sm:pb-1 max-sm:text-lg max-sm:font-bold',
            meta.className,
          )}
        >
          {text && meta.card !== 'title' ? (
            <span aria-hidden="true" className="w-[38%] shrink-0 text-sm font-bold text-muted sm:hidden">
              {text}
            </span>
          ) : null}
          <span className="min-w-0 max-sm:flex-1 max-sm:[overflow-wrap:anywhere]">{content}</span>
        </Tag>
      );
    });

  return (
    <div
      className={cx(
        framed && 'sm:rounded-lg sm:border-slab sm:border-edge sm:bg-panel',
        'sm:overflow-x-auto lg:overflow-x-visible',
        className,
      )}
      aria-busy={busy || undefined}
      {...(wide ? { tabIndex: 0, role: 'region', 'aria-label': label } : {})}
    >
      <table
        role="table"
        aria-label={label}
        className={cx(
          'block w-full border-collapse sm:table',
          density === 'dense' ? 'text-sm' : 'text-base',
          tableClassName,
        )}
      >
        {sized ? (
          <colgroup>
            {table.getVisibleLeafColumns().map((c) => (
              <col key={c.id} style={c.columnDef.size !== undefined ? { width: c.getSize() } : undefined} />
            ))}
          </colgroup>
        ) : null}
        <thead role="rowgroup" className="max-sm:sr-only">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id} role="row">
              {hg.headers.map((h) => {
                const def = h.column.columnDef;
                const can = h.column.getCanSort();
                const dir = h.column.getIsSorted();
                const content = h.isPlaceholder ? null : renderHeader(def, h.getContext());
                return (
                  <th
                    key={h.id}
                    role="columnheader"
                    scope="col"
                    aria-sort={can ? (dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : 'none') : undefined}
                    className={cx(
                      'sticky top-0 z-10 border-b-2 border-edge/30 bg-panel text-sm font-bold tracking-wide text-muted uppercase',
                      pad,
                      def.meta?.align === 'right' ? 'text-right' : 'text-left',
                    )}
                  >
                    {can ? (
                      <button
                        type="button"
                        className="inline-flex min-h-8 items-center gap-1 font-bold uppercase hover:text-ink"
                        onClick={h.column.getToggleSortingHandler()}
                      >
                        {content}
                        <span aria-hidden="true">{dir === 'asc' ? '▲' : dir === 'desc' ? '▼' : '↕'}</span>
                      </button>
                    ) : (
                      content
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody role="rowgroup" className={cx('block sm:table-row-group', busy && 'opacity-60')}>
          {rows.map((row) => {
            const { className: rowClass, ...extra } = rowProps?.(row.original) ?? {};
            return (
              <tr
                key={row.id}
                role="row"
                {...extra}
                className={cx(
                  'block max-sm:flex max-sm:flex-col sm:table-row sm:border-t sm:border-edge/15',
                  framed
                    ? 'max-sm:mb-3 max-sm:rounded-lg max-sm:border-slab max-sm:border-edge max-sm:bg-panel max-sm:p-3'
                    : 'max-sm:border-b-2 max-sm:border-edge/20 max-sm:px-3 max-sm:py-2.5 max-sm:last:border-b-0',
                  rowClass,
                )}
              >
                {cellsOf(row)}
              </tr>
            );
          })}
          {rows.length === 0 && empty ? (
            <tr role="row" className="block sm:table-row">
              <td role="cell" colSpan={leafCount} className="block sm:table-cell">
                {empty}
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
    </div>
  );
}
