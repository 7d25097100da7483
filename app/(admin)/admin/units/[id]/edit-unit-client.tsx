'use client';

import { useQuery } from '@tanstack/react-query';
import Link from 'next/link';
import { FormNotice } from '@/components/ui/field';
import { UnitStatus } from '@/components/ui/unit-status';
import { adminUnitQuery, useUpdateUnitMutation } from '@/lib/queries/admin';
import { UnitForm } from '../_components/unit-form';
import { RetirePanel } from './retire-panel';

const dateFormat = new Intl.DateTimeFormat('en-US', { day: 'numeric', month: 'long', year: 'numeric' });

export function EditUnitClient({ id }: { id: string }) {
  const { data: unit, error } = useQuery(adminUnitQuery(id));
  const update = useUpdateUnitMutation(id);
  if (!unit) return error ? <FormNotice kind="error">{error.message}</FormNotice> : <p className="text-lg">Loading…</p>;
  return (
    <div className="flex flex-col gap-4">
      <header className="flex flex-col gap-1">
        <Link href="/admin/units" className="text-lg underline underline-offset-4">
          ← All units
        </Link>
        <div className="flex flex-wrap items-center gap-3">
          <h1 className="text-3xl font-extrabold">
            {unit.kind === 'tractor' ? 'Tractor' : 'Trailer'} {unit.unitNumber}
          </h1>
          <UnitStatus status={unit.status} retired={Boolean(unit.retiredAt)} />
        </div>
      </header>
      {unit.retiredAt ? (
        <FormNotice kind="error">
          Retired on <span suppressHydrationWarning>{dateFormat.format(new Date(unit.retiredAt))}</span>. Its record is
          kept and can no longer change; it is not offered for new inspections.
        </FormNotice>
      ) : null}
      <UnitForm
        unit={unit}
        readOnly={Boolean(unit.retiredAt)}
        submitLabel="Save changes"
        onSave={async ({ kind: _k, ...body }) => {
          void _k;
          const { unit: saved } = await update.mutateAsync(body);
          return `Unit ${saved.unitNumber} saved.`;
        }}
      />
      {unit.retiredAt ? null : <RetirePanel unit={unit} />}
    </div>
  );
}
