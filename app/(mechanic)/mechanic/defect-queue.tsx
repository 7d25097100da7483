import Link from 'next/link';
import { formatDateTime, zoneLabel } from '@/components/office/format';
import { MajorMark, MinorMark, UnitStatusBadge } from '@/components/office/severity-mark';
import type { DefectQueueGroup, DefectQueueRow } from '@/lib/schemas/defects';

function Row({ d }: { d: DefectQueueRow }) {
  return (
    <li>
      <Link
        href={`/mechanic/defects/${d.id}`}
        className={`grid gap-x-4 gap-y-1 px-4 py-2.5 hover:bg-ground md:grid-cols-[8.5rem_minmax(0,1fr)_15rem] ${d.severity === 'major' ? 'shadow-[inset_8px_0_0_rgb(var(--major))]' : ''}`}
        data-testid="queue-defect"
      >
        <span className="pl-1">{d.severity === 'major' ? <MajorMark compact /> : <MinorMark />}</span>
        <span>
          <span className="font-bold">{d.description}</span>
          <span className="block text-sm text-muted capitalize">
            {zoneLabel(d.zone)} · {d.component}
          </span>
        </span>
        <span className="text-sm text-muted md:text-right">
          {d.status === 'open' ? (
            <>
              reported {formatDateTime(d.reportedAt)}
              <span className="block">by {d.driverName}</span>
            </>
          ) : (
            <>
              {d.status === 'repaired' ? 'repaired' : 'no repair needed'}: {d.certifiedName}
              <span className="block">{formatDateTime(d.certifiedAt)}</span>
            </>
          )}
          {d.photoCount > 0 && (
            <span className="block">
              {d.photoCount} photo{d.photoCount > 1 ? 's' : ''}
            </span>
          )}
        </span>
      </Link>
    </li>
  );
}

export function DefectQueue({
  groups,
  status,
  filteredUnit,
}: {
  groups: DefectQueueGroup[];
  status: 'open' | 'closed' | 'all';
  filteredUnit: string | null;
}) {
  const tab = (s: string, label: string) => (
    <Link
      href={s === 'open' ? '/mechanic' : `/mechanic?status=${s}`}
      aria-current={status === s ? 'page' : undefined}
      className={`rounded-md px-3 py-1.5 font-bold ${status === s ? 'bg-ink text-ground' : 'hover:bg-panel'}`}
    >
      {label}
    </Link>
  );
  const majors = groups.reduce((n, g) => n + g.major.length, 0);
  const minors = groups.reduce((n, g) => n + g.minor.length, 0);
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-2">
        {tab('open', 'Open')}
        {tab('closed', 'Certified')}
        {tab('all', 'All')}
        <p className="ml-auto text-base text-muted">
          {groups.length} unit{groups.length === 1 ? '' : 's'} ·{' '}
          <span className="font-bold text-major">{majors} major</span> ·{' '}
          <span className="font-bold text-minor">{minors} minor</span>
          {filteredUnit && (
            <>
              {' · '}
              <Link href="/mechanic" className="underline">
                all units
              </Link>
            </>
          )}
        </p>
      </div>
      {groups.length === 0 && (
        <p className="rounded-lg border-slab border-edge bg-panel p-6 text-lg">
          Nothing here. No defect waits for the shop.
        </p>
      )}
      {groups.map((g) => (
        <section
          key={g.unitId}
          aria-label={`Unit ${g.unitNumber}`}
          className="rounded-lg border-slab border-edge bg-panel"
          data-testid={`queue-unit-${g.unitNumber}`}
        >
          <header className="flex flex-wrap items-center gap-3 border-b-2 border-edge/20 px-4 py-2">
            <h2 className="text-xl font-extrabold">Unit {g.unitNumber}</h2>
            <span className="text-sm text-muted">{g.unitKind}</span>
            <UnitStatusBadge status={g.unitStatus} />
          </header>
          <ul className="divide-y divide-edge/15">
            {g.major.map((d) => (
              <Row key={d.id} d={d} />
            ))}
            {g.minor.map((d) => (
              <Row key={d.id} d={d} />
            ))}
          </ul>
        </section>
      ))}
    </div>
  );
}
