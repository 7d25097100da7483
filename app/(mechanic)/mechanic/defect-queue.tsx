import Link from 'next/link';
import { zoneLabel } from '@/components/office/format';
import { SeverityMark } from '@/components/ui/severity-mark';
import { NavTabs } from '@/components/ui/tabs';
import { TimeStamp } from '@/components/ui/time-stamp';
import { UnitStatus } from '@/components/ui/unit-status';
import type { DefectQueueGroup, DefectQueueRow } from '@/lib/schemas/defects';
import { countWords, tidyText } from '@/lib/walk/name-finding';
import { EmptyState } from '@/components/ui/empty-state';
import { Panel } from '@/components/ui/panel';

function Row({ d, timeZone }: { d: DefectQueueRow; timeZone: string }) {
  return (
    <li>
      <Link
        href={`/mechanic/defects/${d.id}`}
        className={`grid gap-x-4 gap-y-1 px-4 py-2.5 hover:bg-ground md:grid-cols-[8.5rem_minmax(0,1fr)_15rem] ${d.severity === 'major' ? 'shadow-[inset_8px_0_0_rgb(var(--major))]' : ''}`}
        data-testid="queue-defect"
      >
        <span className="pl-1">
          <SeverityMark severity={d.severity === 'major' ? 'major' : 'minor'} compact />
        </span>
        <span>
          <span className="font-bold">{tidyText(d.description)}</span>
          <span className="block text-sm text-muted capitalize">
            {zoneLabel(d.zone)} · {d.component}
          </span>
        </span>
        <span className="text-sm text-muted md:text-right">
          {d.status === 'open' ? (
            <>
              reported <TimeStamp iso={d.reportedAt} timeZone={timeZone} />
              <span className="block">by {d.driverName}</span>
            </>
          ) : (
            <>
              {d.status === 'repaired' ? 'repaired' : 'no repair needed'}: {d.certifiedName}
              <TimeStamp iso={d.certifiedAt} timeZone={timeZone} className="block" />
            </>
          )}
          {d.photoCount > 0 && <span className="block">{countWords(d.photoCount, 'photo')}</span>}
        </span>
      </Link>
    </li>
  );
}

const statusTabs = [
  { status: 'open', href: '/mechanic', label: 'Open' },
  { status: 'closed', href: '/mechanic?status=closed', label: 'Certified' },
  { status: 'all', href: '/mechanic?status=all', label: 'All' },
];

export function DefectQueue({
  groups,
  status,
  filteredUnit,
  timeZone,
}: {
  timeZone: string;
  groups: DefectQueueGroup[];
  status: 'open' | 'closed' | 'all';
  filteredUnit: string | null;
}) {
  const majors = groups.reduce((n, g) => n + g.major.length, 0);
  const minors = groups.reduce((n, g) => n + g.minor.length, 0);
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-2">
        <NavTabs label="Which defects" items={statusTabs} current={statusTabs.find((t) => t.status === status)?.href} />
        <p className="ml-auto text-base text-muted">
          {countWords(groups.length, 'unit')} · <span className="font-bold text-major">{majors} major</span> ·{' '}
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
        <Panel padding="none">
          <EmptyState title="Nothing here. No defect waits for the shop." />
        </Panel>
      )}
      {groups.map((g) => (
        <Panel
          as="section"
          padding="none"
          key={g.unitId}
          aria-label={`Unit ${g.unitNumber}`}
          data-testid={`queue-unit-${g.unitNumber}`}
        >
          <header className="flex flex-wrap items-center gap-3 border-b-2 border-edge/20 px-4 py-2">
            <h2 className="text-xl font-extrabold">Unit {g.unitNumber}</h2>
            <span className="text-sm text-muted">{g.unitKind}</span>
            <UnitStatus status={g.unitStatus} />
          </header>
          <ul className="divide-y divide-edge/15">
            {g.major.map((d) => (
              <Row key={d.id} d={d} timeZone={timeZone} />
            ))}
            {g.minor.map((d) => (
              <Row key={d.id} d={d} timeZone={timeZone} />
            ))}
          </ul>
        </Panel>
      ))}
    </div>
  );
}
