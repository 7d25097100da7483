'use client';

import { useQuery } from '@tanstack/react-query';
import { createColumnHelper, type SortingState } from '@tanstack/react-table';
import Link from 'next/link';
import { usePathname, useRouter, useSearchParams } from 'next/navigation';
import { useMemo } from 'react';
import { formatDuration, kindLabel } from '@/components/office/format';
import { SeverityMark } from '@/components/ui/severity-mark';
import { buttonClass } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { Panel, panelClass } from '@/components/ui/panel';
import { Table } from '@/components/ui/table';
import { TimeStamp } from '@/components/ui/time-stamp';
import { useHydrated } from '@/components/ui/use-hydrated';
import { paramsFromSearch, reportListOptions, toReportSearch, type ReportListParams } from '@/lib/queries/reports';
import type { ReportRow } from '@/lib/schemas/reports';

const col = createColumnHelper<ReportRow>();

const makeColumns = (tz: string) => [
  col.accessor('startedAt', {
    header: 'Started',
    meta: { card: 'title' },
    cell: (c) => (
      <Link
        href={`/supervisor/reports/${c.row.original.id}`}
        className="font-bold underline-offset-2 hover:underline"
        data-testid="report-link"
      >
        <TimeStamp iso={c.getValue()} timeZone={tz} />
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
      if (!r.majorCount && !r.minorCount) return <SeverityMark severity="pass" label="None" compact />;
      return (
        <span className="flex flex-col">
          {r.majorCount > 0 && <SeverityMark severity="major" count={r.majorCount} compact />}
          {r.minorCount > 0 && <SeverityMark severity="minor" count={r.minorCount} label="minor" compact />}
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

  const page = Number(params.page ?? 1);
  const exportHref = `/api/reports/export?${toReportSearch({ ...params, page: undefined, pageSize: undefined })}`;
  const field = 'rounded-md border-2 border-edge/50 bg-panel px-2 py-1.5 text-base';

  return (
    <section className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h1 className="text-3xl font-extrabold">Inspection reports</h1>
        <a href={exportHref} className={buttonClass('plain', 'compact')} download>
          Export CSV ({data?.total ?? '…'} reports)
        </a>
      </div>

      <form
        aria-label="Filters"
        data-live={live ? 'yes' : 'no'}
        className={`grid grid-cols-[repeat(auto-fill,minmax(8.5rem,1fr))] gap-3 ${panelClass({ tone: 'quiet', padding: 'sm' })}`}
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
        <Panel as="p" role="alert" tone="major" padding="sm" className="font-bold">
          {error.message}
        </Panel>
      )}

      <Table
        label="Inspection reports"
        data={data?.rows ?? []}
        columns={columns}
        getRowId={(r) => r.id}
        manualSorting
        sorting={sorting}
        onSortingChange={(updater) => {
          const next = typeof updater === 'function' ? updater(sorting) : updater;
          const s = next[0];
          set({ sort: s?.id ?? 'startedAt', dir: s ? (s.desc ? 'desc' : 'asc') : 'desc' });
        }}
        busy={isFetching}
        tableClassName="sm:min-w-[860px]"
        rowProps={(r) => ({
          'data-testid': 'report-row',
          className: r.majorCount ? 'shadow-[inset_8px_0_0_rgb(var(--major))] max-sm:pl-5' : undefined,
        })}
        empty={data ? <EmptyState title="No report matches these filters." /> : null}
      />

      <nav aria-label="Pages" className="flex flex-wrap items-center gap-3 text-base">
        <button
          type="button"
          className={buttonClass('plain', 'compact')}
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
          className={buttonClass('plain', 'compact')}
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
