import Link from 'next/link';
import { formatAge, formatDateTime, kindLabel } from '@/components/office/format';
import { UnitStatusBadge } from '@/components/office/severity-mark';
import type { SupervisorBoard } from '@/lib/schemas/dashboard';

export function UnitsBoard({ units, timezone }: { units: SupervisorBoard['units']; timezone: string }) {
  const out = units.filter((u) => u.status === 'out_of_service').length;
  return (
    <section aria-labelledby="units-heading" className="rounded-lg border-slab border-edge bg-panel">
      <header className="flex flex-wrap items-baseline justify-between gap-3 border-b-2 border-edge/20 px-4 py-3">
        <h2 id="units-heading" className="text-xl font-extrabold">
          Units
        </h2>
        <p className="text-base text-muted">
          <span className="font-bold text-ink">{units.length - out}</span> in service ·{' '}
          <span className="font-bold text-major">{out}</span> out of service
        </p>
      </header>
      <div className="overflow-x-auto">
        <table className="w-full min-w-[34rem] text-base">
          <thead className="text-left text-sm tracking-wide text-muted uppercase">
            <tr>
              <th className="px-4 py-2">Unit</th>
              <th className="px-2 py-2">Status</th>
              <th className="px-2 py-2">Last inspection</th>
              <th className="px-4 py-2 text-right">Open defects</th>
            </tr>
          </thead>
          <tbody>
            {units.map((u) => (
              <tr key={u.id} data-testid={`unit-row-${u.unitNumber}`} className="border-t border-edge/15 align-top">
                <td className="px-4 py-2">
                  <span className="font-extrabold">{u.unitNumber}</span>{' '}
                  <span className="text-sm text-muted">{u.kind}</span>
                </td>
                <td className="px-2 py-2">
                  <UnitStatusBadge status={u.status} />
                </td>
                <td className="px-2 py-2">
                  {u.last ? (
                    <Link href={`/supervisor/reports/${u.last.id}`} className="underline-offset-2 hover:underline">
                      <span className="font-bold">{formatAge(u.last.ageHours)}</span>{' '}
                      <span className="block text-sm text-muted">
                        {kindLabel(u.last.kind)}, {u.last.driverName}, {formatDateTime(u.last.startedAt, timezone)}
                      </span>
                    </Link>
                  ) : (
                    <span className="text-muted">none yet</span>
                  )}
                </td>
                <td className="px-4 py-2 text-right">
                  {u.openMajor + u.openMinor === 0 ? (
                    <span className="text-muted">0</span>
                  ) : (
                    <Link href={`/mechanic?unit=${u.id}`} className="hover:underline">
                      {u.openMajor > 0 && <span className="font-extrabold text-major">{u.openMajor} major</span>}
                      {u.openMajor > 0 && u.openMinor > 0 && ' · '}
                      {u.openMinor > 0 && <span className="font-bold text-minor">{u.openMinor} minor</span>}
                    </Link>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
