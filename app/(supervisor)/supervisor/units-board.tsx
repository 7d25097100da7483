'use client';

import { createColumnHelper } from '@tanstack/react-table';
import Link from 'next/link';
import { kindLabel } from '@/components/office/format';
import { Panel } from '@/components/ui/panel';
import { Table } from '@/components/ui/table';
import { TimeStamp } from '@/components/ui/time-stamp';
import { UnitStatus } from '@/components/ui/unit-status';
import type { SupervisorBoard } from '@/lib/schemas/dashboard';

type BoardUnit = SupervisorBoard['units'][number];
const col = createColumnHelper<BoardUnit>();

const makeColumns = (timezone: string) => [
  col.accessor('unitNumber', {
    header: 'Unit',
    meta: { card: 'title' },
    cell: ({ row: { original: u } }) => (
      <>
        <span className="font-extrabold">{u.unitNumber}</span> <span className="text-sm text-muted">{u.kind}</span>
      </>
    ),
  }),
  col.accessor('status', {
    header: 'Status',
    cell: (c) => <UnitStatus status={c.getValue() === 'out_of_service' ? 'out_of_service' : 'in_service'} />,
  }),
  col.display({
    id: 'last',
    header: 'Last inspection',
    cell: ({ row: { original: u } }) =>
      u.last ? (
        <Link href={`/supervisor/reports/${u.last.id}`} className="underline-offset-2 hover:underline">
          <TimeStamp iso={u.last.startedAt} timeZone={timezone} relative className="font-bold" />{' '}
          <span className="block text-sm text-muted">
            {kindLabel(u.last.kind)}, {u.last.driverName}, <TimeStamp iso={u.last.startedAt} timeZone={timezone} />
          </span>
        </Link>
      ) : (
        <span className="text-muted">none yet</span>
      ),
  }),
  col.display({
    id: 'open',
    header: 'Open defects',
    meta: { align: 'right' },
    cell: ({ row: { original: u } }) =>
      u.openMajor + u.openMinor === 0 ? (
        <span className="text-muted">0</span>
      ) : (
        <Link href={`/mechanic?unit=${u.id}`} className="hover:underline">
          {u.openMajor > 0 && <span className="font-extrabold text-major">{u.openMajor} major</span>}
          {u.openMajor > 0 && u.openMinor > 0 && ' · '}
          {u.openMinor > 0 && <span className="font-bold text-minor">{u.openMinor} minor</span>}
        </Link>
      ),
  }),
];

export function UnitsBoard({ units, timezone }: { units: SupervisorBoard['units']; timezone: string }) {
  const out = units.filter((u) => u.status === 'out_of_service').length;
  return (
    <Panel as="section" padding="none" aria-labelledby="units-heading">
      <header className="flex flex-wrap items-baseline justify-between gap-3 border-b-2 border-edge/20 px-4 py-3">
        <h2 id="units-heading" className="text-xl font-extrabold">
          Units
        </h2>
        <p className="text-base text-muted">
          <span className="font-bold text-ink">{units.length - out}</span> in service ·{' '}
          <span className="font-bold text-major">{out}</span> out of service
        </p>
      </header>
      <Table
        label="Units"
        data={units}
        columns={makeColumns(timezone)}
        getRowId={(u) => u.id}
        enableSorting={false}
        framed={false}
        rowProps={(u) => ({ 'data-testid': `unit-row-${u.unitNumber}` })}
      />
    </Panel>
  );
}
