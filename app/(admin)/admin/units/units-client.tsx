'use client';

import { useQuery } from '@tanstack/react-query';
import Link from 'next/link';
import { useState } from 'react';
import { FormNotice } from '@/components/admin/field';
import { officeButtonClass, panelClass } from '@/components/admin/office-controls';
import { UnitStatusBadge } from '@/components/admin/unit-status-badge';
import { adminUnitsQuery } from '@/lib/queries/admin';
import type { UnitDto } from '@/lib/schemas/units';

type KindFilter = 'all' | 'tractor' | 'trailer';

const tireCount = (u: UnitDto) => u.axles.reduce((n, a) => n + a.tires.length, 0);

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
        <Link href="/admin/units/new" className={officeButtonClass('primary')}>
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
              className={`${officeButtonClass(kind === k ? 'primary' : 'plain')} cursor-pointer has-[:focus-visible]:outline-4 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-vest`}
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
      <section aria-label="Units" className={panelClass}>
        {isPending ? <p className="p-4 text-lg">Loading units…</p> : null}
        <table className="hidden w-full border-collapse text-left text-lg md:table">
          <thead className="border-b-slab border-edge text-base">
            <tr>
              <th scope="col" className="px-3 py-2">
                Unit
              </th>
              <th scope="col" className="px-3 py-2">
                Make, model, year
              </th>
              <th scope="col" className="px-3 py-2">
                Plate
              </th>
              <th scope="col" className="px-3 py-2">
                VIN
              </th>
              <th scope="col" className="px-3 py-2">
                Axles
              </th>
              <th scope="col" className="px-3 py-2">
                State
              </th>
            </tr>
          </thead>
          <tbody>
            {shown.map((u) => (
              <tr key={u.id} className="border-b-2 border-edge/20 last:border-b-0 hover:bg-ground">
                <th scope="row" className="px-3 py-2">
                  <Link href={`/admin/units/${u.id}`} className="inline-flex min-h-11 flex-col justify-center">
                    <span className="text-xl font-extrabold underline decoration-2 underline-offset-4">
                      {u.unitNumber}
                    </span>
                    <span className="text-sm font-normal text-muted">
                      {u.kind === 'tractor' ? 'Tractor' : 'Trailer'}
                    </span>
                  </Link>
                </th>
                <td className="px-3 py-2">
                  {[u.make, u.model, u.year].filter(Boolean).join(' · ') || <span className="text-muted">—</span>}
                </td>
                <td className="px-3 py-2">
                  {u.plate ? (
                    `${u.plate}${u.plateJurisdiction ? ` (${u.plateJurisdiction})` : ''}`
                  ) : (
                    <span className="text-muted">—</span>
                  )}
                </td>
                <td className="px-3 py-2 font-mono text-base">
                  {u.vin ?? <span className="font-sans text-muted">—</span>}
                </td>
                <td className="px-3 py-2">
                  {u.axles.length} axles · {tireCount(u)} tires
                </td>
                <td className="px-3 py-2">
                  <UnitStatusBadge unit={u} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        <ul className="md:hidden">
          {shown.map((u) => (
            <li key={u.id} className="border-b-2 border-edge/20 last:border-b-0">
              <Link href={`/admin/units/${u.id}`} className="flex flex-col gap-1 p-3">
                <span className="flex flex-wrap items-center justify-between gap-2">
                  <span>
                    <span className="text-xl font-extrabold underline decoration-2 underline-offset-4">
                      {u.unitNumber}
                    </span>{' '}
                    <span className="text-base text-muted">{u.kind === 'tractor' ? 'Tractor' : 'Trailer'}</span>
                  </span>
                  <UnitStatusBadge unit={u} />
                </span>
                <span className="text-base">{[u.make, u.model, u.year].filter(Boolean).join(' · ')}</span>
                <span className="text-base text-muted">
                  {u.plate ? `${u.plate}${u.plateJurisdiction ? ` (${u.plateJurisdiction})` : ''} · ` : ''}
                  {u.axles.length} axles · {tireCount(u)} tires
                </span>
              </Link>
            </li>
          ))}
        </ul>
        {units && shown.length === 0 ? (
          <p className="p-4 text-lg">No units match. Change the filter above or add one.</p>
        ) : null}
      </section>
    </div>
  );
}
