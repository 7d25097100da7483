'use client';

import Link from 'next/link';
import { buttonClass } from '@/components/ui/button';
import { Panel } from '@/components/ui/panel';

type Recent = {
  id: string;
  kind: string;
  status: string;
  startedAt: string;
  finishedAt: string | null;
  tractorNumber: string;
  trailerNumber: string | null;
  defectCount: number;
};

const kindLabel = (k: string) => (k === 'pre_trip' ? 'Pre-trip' : 'Post-trip');
const when = (iso: string) =>
  new Date(iso).toLocaleString([], { weekday: 'short', hour: '2-digit', minute: '2-digit' });

export function DriverHomeClient({ recent }: { recent: Recent[] }) {
  const drafts = recent.filter((r) => r.status === 'draft');
  return (
    <div className="flex flex-col gap-6">
      <div className="grid gap-3 sm:grid-cols-2">
        <Link href="/driver/start?kind=pre_trip" className={buttonClass('primary')}>
          Start pre-trip
        </Link>
        <Link href="/driver/start?kind=post_trip" className={buttonClass()}>
          Start post-trip
        </Link>
      </div>
      {drafts.length > 0 && (
        <section className="space-y-3">
          <h2 className="text-2xl font-bold">Not signed yet</h2>
          {drafts.map((d) => (
            <Link key={d.id} href={`/driver/inspections/${d.id}/walk`} className={buttonClass()}>
              Resume {kindLabel(d.kind).toLowerCase()} · unit {d.tractorNumber}
              {d.trailerNumber ? ` + ${d.trailerNumber}` : ''}
            </Link>
          ))}
        </section>
      )}
      <section className="space-y-3">
        <h2 className="text-2xl font-bold">Your last reports</h2>
        {recent.filter((r) => r.status === 'submitted').length === 0 && <p className="text-lg text-muted">None yet.</p>}
        <ul className="space-y-2">
          {recent
            .filter((r) => r.status === 'submitted')
            .map((r) => (
              <Panel
                as="li"
                padding="none"
                key={r.id}
                className="flex min-h-target flex-wrap items-center justify-between gap-2 px-4 py-3 text-lg"
              >
                <span>
                  <span className="font-bold">{kindLabel(r.kind)}</span> · {r.tractorNumber}
                  {r.trailerNumber ? ` + ${r.trailerNumber}` : ''} · {when(r.startedAt)}
                </span>
                <span className={r.defectCount ? 'font-bold text-minor' : 'text-pass'}>
                  {r.defectCount ? `▲ ${r.defectCount} defect${r.defectCount > 1 ? 's' : ''}` : '✓ no defects'}
                </span>
              </Panel>
            ))}
        </ul>
      </section>
    </div>
  );
}
