'use client';

import { useQuery } from '@tanstack/react-query';
import { createColumnHelper } from '@tanstack/react-table';
import Link from 'next/link';
import { useState } from 'react';
import { FormNotice } from '@/components/ui/field';
import { UnitStatus } from '@/components/ui/unit-status';
import { adminUnitsQuery } from '@/lib/queries/admin';
import type { UnitDto } from '@/lib/schemas/units';
import { buttonClass } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';
import { Table } from '@/components/ui/table';

type KindFilter = 'all' | 'tractor' | 'trailer';

const tireCount = (u: UnitDto) => u.axles.reduce((n, a) => n + a.tires.length, 0);

const col = createColumnHelper<UnitDto>();
const kindWord = (u: UnitDto) => (u.kind === 'tractor' ? 'Tractor' : 'Trailer');
const columns = [
  col.accessor('unitNumber', {
    header: 'Unit',
    meta: { rowHeader: true, card: 'title' },
    cell: ({ row: { original: u } }) => (
      <Link href={`/admin/units/${u.id}`} className="inline-flex min-h-11 flex-col justify-center">
        <span className="text-xl font-extrabold underline decoration-2 underline-offset-4">{u.unitNumber}</span>
        <span className="text-sm font-normal text-muted">{kindWord(u)}</span>
      </Link>
    ),
  }),
  col.accessor((u) => [u.make, u.model, u.year].filter(Boolean).join(' · '), {
    id: 'model',
    header: 'Make, model, year',
    cell: (c) => c.getValue() || <span className="text-muted">—</span>,
  }),
  col.accessor('plate', {
    header: 'Plate',
    cell: ({ row: { original: u } }) =>
      u.plate ? (
        `${u.plate}${u.plateJurisdiction ? ` (${u.plateJurisdiction})` : ''}`
      ) : (
        <span className="text-muted">—</span>
      ),
  }),
  col.accessor('vin', {
    header: 'VIN',
    meta: { className: 'font-mono text-base break-all' },
    cell: (c) => c.getValue() ?? <span className="font-sans text-muted">—</span>,
  }),
  col.accessor(tireCount, {
    id: 'axles',
    header: 'Axles',
    cell: ({ row: { original: u } }) => `${u.axles.length} axles · ${tireCount(u)} tires`,
  }),
  col.accessor('status', {
    header: 'State',
    cell: ({ row: { original: u } }) => <UnitStatus status={u.status} retired={Boolean(u.retiredAt)} />,
  }),
];

export function UnitsClient({ added }: { added: string | null }) {
  const { data: units, error, isPending } = useQuery(adminUnitsQuery());
  const [kind, setKind] = useState<KindFilter>('all');
  const [showRetired, setShowRetired] = useState(false);
  const shown = (units ?? []).filter((u) => (kind === 'all' || u.kind === kind) && (showRetired || !u.retiredAt));
  const retiredCount = (units ?? []).filter((u) => u.retiredAt).length;

  return (
    <div className="flex flex-col gap-4">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-3xl font-extrabold">Units</h1>
          <p className="text-lg text-muted">Tractors and trailers drivers can pick for an inspection.</p>
        </div>
        <Link href="/admin/units/new" className={buttonClass('primary', 'compact')}>
          + Add a unit
        </Link>
      </header>
      {added ? <FormNotice kind="saved">Unit {added} added.</FormNotice> : null}

      <div className="flex flex-wrap items-center gap-4">
        <fieldset className="flex flex-wrap gap-2">
          <legend className="sr-only">Show</legend>
          {(['all', 'tractor', 'trailer'] as const).map((k) => (
            <label
              key={k}
              className={`${buttonClass(kind === k ? 'primary' : 'plain', 'compact')} cursor-pointer has-[:focus-visible]:outline-4 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-vest`}
            >
              <input
                type="radio"
                name="kind-filter"
                className="sr-only"
                checked={kind === k}
                onChange={() => setKind(k)}
              />
              {k === 'all' ? 'All' : k === 'tractor' ? 'Tractors' : 'Trailers'}
            </label>
          ))}
        </fieldset>
        <label className="flex min-h-12 items-center gap-2 text-lg">
          <input
            type="checkbox"
            className="size-6 accent-[rgb(var(--ink))]"
            checked={showRetired}
            onChange={(e) => setShowRetired(e.target.checked)}
          />
          Show retired ({retiredCount})
        </label>
      </div>

      {error ? <FormNotice kind="error">{error.message}</FormNotice> : null}
      <section aria-label="Units" className={panelClass({ padding: 'none' })}>
        {isPending ? <p className="p-4 text-lg">Loading units…</p> : null}
        <Table
          label="Units"
          data={shown}
          columns={columns}
          getRowId={(u) => u.id}
          framed={false}
          tableClassName="text-lg"
        />
        {units && shown.length === 0 ? (
          <p className="p-4 text-lg">No units match. Change the filter above or add one.</p>
        ) : null}
      </section>
    </div>
  );
}
