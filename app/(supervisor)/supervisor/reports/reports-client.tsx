'use client';

import { useQuery } from '@tanstack/react-query';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  useReactTable,
  type SortingState,
} from '@tanstack/react-table';
import Link from 'next/link';
import { usePathname, useRouter, useSearchParams } from 'next/navigation';
import { useMemo } from 'react';
import { formatDateTime, formatDuration, kindLabel } from '@/components/office/format';
import { MajorMark, MinorMark, PassMark } from '@/components/office/severity-mark';
import { useHydrated } from '@/components/ui/use-hydrated';
import { paramsFromSearch, reportListOptions, toReportSearch, type ReportListParams } from '@/lib/queries/reports';
import type { ReportRow } from '@/lib/schemas/reports';

const col = createColumnHelper<ReportRow>();

const makeColumns = (tz: string) => [
  col.accessor('startedAt', {
    header: 'Started',
    cell: (c) => (
      <Link
        href={`/supervisor/reports/${c.row.original.id}`}
        className="font-bold underline-offset-2 hover:underline"
        data-testid="report-link"
      >
        {formatDateTime(c.getValue(), tz)}
      </Link>
    ),
  }),
  col.accessor('kind', { header: 'Type', cell: (c) => kindLabel(c.getValue()) }),
  col.accessor('driverName', { header: 'Driver' }),
  col.accessor('tractorNumber', {
    header: 'Units',
    cell: (c) => (
      <span className="font-bold">
        {c.getValue()}
        {c.row.original.trailerNumber ? (
          <span className="font-normal text-muted"> + {c.row.original.trailerNumber}</span>
        ) : null}
      </span>
    ),
  }),
  col.accessor('durationS', {
    header: 'Duration',
    cell: (c) => (
      <span className={c.row.original.short ? 'font-bold text-minor' : ''}>
        {formatDuration(c.getValue())}
        {c.row.original.short && <span className="ml-1 text-sm">(under {c.row.original.minimumS / 60} min)</span>}
      </span>
    ),
  }),
  col.accessor((r) => r.majorCount * 1000 + r.minorCount, {
    id: 'defects',
    header: 'Defects',
    cell: (c) => {
      const r = c.row.original;
      if (!r.majorCount && !r.minorCount) return <PassMark label="None" />;
      return (
        <span className="flex flex-col">
          {r.majorCount > 0 && <MajorMark compact />}
          {r.minorCount > 0 && <MinorMark label={`${r.minorCount} minor`} />}
          {r.openCount > 0 && <span className="text-sm text-muted">{r.openCount} open</span>}
        </span>
      );
    },
  }),
  col.accessor('reviewedAt', {
    header: 'Review',
    enableSorting: false,
    cell: (c) =>
      c.row.original.status === 'draft' ? (
        <span className="text-muted">walking</span>
      ) : c.getValue() ? (
        <span className="text-pass">reviewed</span>
      ) : (
        <span className="font-bold">to review</span>
      ),
  }),
];

const sortable = new Set(['startedAt', 'kind', 'driverName', 'tractorNumber', 'durationS', 'defects']);

type Option = { id: string; name?: string; unitNumber?: string; kind?: string };

export function ReportsClient({ drivers, units, timezone }: { drivers: Option[]; units: Option[]; timezone: string }) {
  const columns = useMemo(() => makeColumns(timezone), [timezone]);
  const router = useRouter();
  const pathname = usePathname();
  const search = useSearchParams();
  const params = useMemo(() => paramsFromSearch(new URLSearchParams(search.toString())), [search]);
  const { data, isFetching, error } = useQuery(reportListOptions(params));
  const live = useHydrated();

  const set = (next: ReportListParams, resetPage = true) => {
    const merged: ReportListParams = { ...params, ...next };
    if (resetPage) delete merged.page;
    for (const k of Object.keys(merged) as (keyof ReportListParams)[])
      if (merged[k] === '' || merged[k] === undefined) delete merged[k];
    const qs = toReportSearch(merged);
    router.replace(qs ? `${pathname}?${qs}` : pathname, { scroll: false });
  };

  const sorting: SortingState = [{ id: String(params.sort ?? 'startedAt'), desc: (params.dir ?? 'desc') === 'desc' }];
  const table = useReactTable({
    data: data?.rows ?? [],
    columns,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualPagination: true,
    pageCount: data?.pageCount ?? 1,
    state: { sorting },
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      const s = next[0];
      set({ sort: s?.id ?? 'startedAt', dir: s ? (s.desc ? 'desc' : 'asc') : 'desc' });
    },
  });

  const page = Number(params.page ?? 1);
  const exportHref = `/api/reports/export?${toReportSearch({ ...params, page: undefined, pageSize: undefined })}`;
  const field = 'rounded-md border-2 border-edge/50 bg-panel px-2 py-1.5 text-base';

  return (
    <section className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h1 className="text-3xl font-extrabold">Inspection reports</h1>
        <a
          href={exportHref}
          className="rounded-lg border-slab border-edge bg-panel px-4 py-2 text-base font-bold hover:bg-ground"
          download
        >
          Export CSV ({data?.total ?? '…'} reports)
        </a>
      </div>

      <form
        aria-label="Filters"
        data-live={live ? 'yes' : 'no'}
        className="grid grid-cols-[repeat(auto-fill,minmax(9.5rem,1fr))] gap-3 rounded-lg border-2 border-edge/30 bg-panel p-3"
        onSubmit={(e) => e.preventDefault()}
      >
        <label className="flex flex-col text-sm font-bold">
          From
          <input
            type="date"
            className={field}
            value={String(params.from ?? '')}
            onChange={(e) => set({ from: e.target.value })}
          />
        </label>
        <label className="flex flex-col text-sm font-bold">
          To
          <input
            type="date"
            className={field}
            value={String(params.to ?? '')}
            onChange={(e) => set({ to: e.target.value })}
          />
        </label>
        <label className="flex flex-col text-sm font-bold">
          Driver
          <select
            className={field}
            value={String(params.driverId ?? '')}
            onChange={(e) => set({ driverId: e.target.value })}
          >
            <option value="">any</option>
            {drivers.map((d) => (
              <option key={d.id} value={d.id}>
                {d.name}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-sm font-bold">
          Unit
          <select
            className={field}
            value={String(params.unitId ?? '')}
            onChange={(e) => set({ unitId: e.target.value })}
          >
            <option value="">any</option>
            {units.map((u) => (
              <option key={u.id} value={u.id}>
                {u.unitNumber} ({u.kind})
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-sm font-bold">
          Type
          <select className={field} value={String(params.kind ?? '')} onChange={(e) => set({ kind: e.target.value })}>
            <option value="">any</option>
            <option value="pre_trip">pre-trip</option>
            <option value="post_trip">post-trip</option>
          </select>
        </label>
        <label className="flex flex-col text-sm font-bold">
          Defects
          <select
            className={field}
            value={String(params.hasDefects ?? '')}
            onChange={(e) => set({ hasDefects: e.target.value })}
          >
            <option value="">any</option>
            <option value="yes">with defects</option>
            <option value="no">none</option>
          </select>
        </label>
        <label className="flex flex-col text-sm font-bold">
          Duration
          <select className={field} value={String(params.short ?? '')} onChange={(e) => set({ short: e.target.value })}>
            <option value="">any</option>
            <option value="yes">under the minimum</option>
            <option value="no">at or over it</option>
          </select>
        </label>
        <label className="flex flex-col text-sm font-bold">
          Status
          <select
            className={field}
            value={String(params.status ?? '')}
            onChange={(e) => set({ status: e.target.value })}
          >
            <option value="">any</option>
            <option value="unreviewed">to review</option>
            <option value="reviewed">reviewed</option>
            <option value="draft">still walking</option>
          </select>
        </label>
      </form>

      {error && (
        <p role="alert" className="rounded-lg border-slab border-major p-3 font-bold">
          {error.message}
        </p>
      )}

      <div className="overflow-x-auto rounded-lg border-slab border-edge bg-panel" aria-busy={isFetching}>
        <table className="w-full min-w-[860px] text-base">
          <thead className="text-left text-sm tracking-wide text-muted uppercase">
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id} className="border-b-2 border-edge/30">
                {hg.headers.map((h) => {
                  const can = sortable.has(h.column.id);
                  const dir = h.column.getIsSorted();
                  return (
                    <th
                      key={h.id}
                      className="px-3 py-2"
                      aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : 'none'}
                    >
                      {can ? (
                        <button
                          type="button"
                          className="inline-flex items-center gap-1 font-bold uppercase hover:text-ink"
                          onClick={h.column.getToggleSortingHandler()}
                        >
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden>{dir === 'asc' ? '▲' : dir === 'desc' ? '▼' : '↕'}</span>
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className={isFetching ? 'opacity-60' : ''}>
            {table.getRowModel().rows.map((row) => (
              <tr
                key={row.id}
                className={`border-t border-edge/15 align-top ${row.original.majorCount ? 'shadow-[inset_8px_0_0_rgb(var(--major))]' : ''}`}
                data-testid="report-row"
              >
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-3 py-2">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
            {data && data.rows.length === 0 && (
              <tr>
                <td colSpan={columns.length} className="px-3 py-8 text-center text-muted">
                  No report matches these filters.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>

      <nav aria-label="Pages" className="flex flex-wrap items-center gap-3 text-base">
        <button
          type="button"
          className="rounded-lg border-slab border-edge bg-panel px-4 py-2 font-bold disabled:opacity-40"
          disabled={page <= 1}
          onClick={() => set({ page: page - 1 }, false)}
        >
          Newer
        </button>
        <span>
          Page <span className="font-bold">{page}</span> of {data?.pageCount ?? '…'} · {data?.total ?? '…'} reports
        </span>
        <button
          type="button"
          className="rounded-lg border-slab border-edge bg-panel px-4 py-2 font-bold disabled:opacity-40"
          disabled={!data || page >= data.pageCount}
          onClick={() => set({ page: page + 1 }, false)}
        >
          Older
        </button>
        <label className="ml-auto flex items-center gap-2 text-sm font-bold">
          Rows
          <select
            className={field}
            value={String(params.pageSize ?? 25)}
            onChange={(e) => set({ pageSize: e.target.value })}
          >
            {[25, 50, 100].map((n) => (
              <option key={n}>{n}</option>
            ))}
          </select>
        </label>
      </nav>
    </section>
  );
}
