import Link from 'next/link';
import { formatDuration, kindLabel } from '@/components/office/format';
import type { SupervisorBoard } from '@/lib/schemas/dashboard';
import { EmptyState } from '@/components/ui/empty-state';
import { TimeStamp } from '@/components/ui/time-stamp';
import { Panel } from '@/components/ui/panel';

const reasonText: Record<string, string> = {
  major_defect: 'major defect',
  short: 'shorter than minimum',
  zones_skipped: 'zones skipped',
  low_confidence: 'unsure match not confirmed',
  no_post_trip: 'no post-trip',
};

function Reason({ reason }: { reason: string }) {
  const major = reason === 'major_defect';
  return (
    <span
      className={`inline-flex items-center gap-1 rounded border-2 px-1.5 text-sm font-bold ${major ? 'border-major bg-major text-on-major' : 'border-edge/40'}`}
    >
      {major && <span aria-hidden className="inline-block h-3 w-1 bg-on-major" />}
      {reasonText[reason] ?? reason}
    </span>
  );
}

export function AttentionList({
  rows,
  days,
  fleet,
}: {
  rows: SupervisorBoard['attention'];
  days: number;
  fleet: SupervisorBoard['fleet'];
}) {
  const open = rows.filter((r) => !r.reviewedAt);
  return (
    <Panel as="section" padding="none" aria-labelledby="attention-heading">
      <header className="border-b-2 border-edge/20 px-4 py-3">
        <h2 id="attention-heading" className="text-xl font-extrabold">
          Needs a look
        </h2>
        <p className="text-sm text-muted">
          Last {days} days · {open.length} not reviewed · minimum {fleet.minPretripMinutes} min pre-trip,{' '}
          {fleet.minPosttripMinutes} min post-trip (fleet setting)
        </p>
      </header>
      {rows.length === 0 ? (
        <EmptyState title="Nothing needs a look." />
      ) : (
        <ul className="divide-y divide-edge/15">
          {rows.map((r) => (
            <li key={r.id} className={r.reviewedAt ? 'bg-ground' : ''}>
              <Link
                href={`/supervisor/reports/${r.id}`}
                className="block px-4 py-2.5 hover:bg-ground"
                data-testid="attention-row"
              >
                <div className="flex flex-wrap items-baseline gap-x-3">
                  <span className="font-extrabold">
                    {r.tractorNumber}
                    {r.trailerNumber ? ` + ${r.trailerNumber}` : ''}
                  </span>
                  <span>{kindLabel(r.kind)}</span>
                  <span className="text-muted">{r.driverName}</span>
                  <span className="ml-auto text-sm text-muted tabular-nums">
                    <TimeStamp iso={r.startedAt} timeZone={fleet.timezone} /> · {formatDuration(r.durationS)}
                  </span>
                </div>
                <div className="mt-1 flex flex-wrap gap-1.5">
                  {r.reasons.map((x) => (
                    <Reason key={x} reason={x} />
                  ))}
                  {r.reasons.includes('zones_skipped') && (
                    <span className="text-sm text-muted">
                      {r.zonesWalked} of {r.zonesExpected} zones
                    </span>
                  )}
                  {r.reviewedAt && <span className="text-sm text-muted">reviewed</span>}
                </div>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </Panel>
  );
}
