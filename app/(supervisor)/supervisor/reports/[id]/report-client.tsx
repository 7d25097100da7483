'use client';

import { useQuery } from '@tanstack/react-query';
import Link from 'next/link';
import { useState } from 'react';
import { formatDuration, kindLabel } from '@/components/office/format';
import { useHydrated } from '@/components/ui/use-hydrated';
import { Button, buttonClass } from '@/components/ui/button';
import { Panel, panelClass } from '@/components/ui/panel';
import { SeverityMark } from '@/components/ui/severity-mark';
import { TimeStamp } from '@/components/ui/time-stamp';
import { UnitStatus } from '@/components/ui/unit-status';
import { reportDetailOptions, useNotifyShopMutation, useReviewReportMutation } from '@/lib/queries/reports';
import type { ReportDetail } from '@/lib/schemas/reports';
import { Transcript } from './transcript';

function Fact({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div>
      <dt className="text-sm font-bold tracking-wide text-muted uppercase">{label}</dt>
      <dd className="text-base">{children}</dd>
    </div>
  );
}

function HashState({ hash }: { hash: ReportDetail['hash'] }) {
  if (hash.state === 'mismatch')
    return (
      <div role="alert" data-testid="hash-mismatch" className={`${panelClass()} bg-major text-on-major`}>
        <p className="text-xl font-extrabold">THE RECORD DOES NOT MATCH ITS SIGNATURE</p>
        <p>
          The steps stored for this report no longer give the hash signed with it: something changed after the driver
          signed. Keep this report as it is and tell the fleet administrator.
        </p>
        <p className="mt-1 font-mono text-sm break-all">signed {hash.stored}</p>
        <p className="font-mono text-sm break-all">now {hash.computed}</p>
      </div>
    );
  if (hash.state === 'unsigned') return <p className="text-muted">Not signed yet: no content hash.</p>;
  return (
    <p className="flex flex-wrap items-center gap-2 text-sm" data-testid="hash-match">
      <SeverityMark severity="pass" label="Rows match the signed hash" />
      <span className="font-mono break-all text-muted">{hash.stored}</span>
    </p>
  );
}

export function ReportClient({ id }: { id: string }) {
  const { data: r } = useQuery(reportDetailOptions(id));
  const review = useReviewReportMutation(id);
  const notify = useNotifyShopMutation(id);
  const [note, setNote] = useState<string | null>(null);
  const live = useHydrated();
  if (!r) return <p>Loading the report…</p>;
  const tz = r.timezone;
  const openDefects = r.defects.filter((d) => d.status === 'open');

  return (
    <article className="space-y-5">
      <Link href="/supervisor/reports" className="text-base font-bold underline-offset-2 hover:underline">
        ← All reports
      </Link>
      <Panel as="header" className="space-y-3">
        <div className="flex flex-wrap items-baseline gap-x-4 gap-y-1">
          <h1 className="text-3xl font-extrabold">
            {kindLabel(r.kind)} · unit {r.tractor.number}
            {r.trailer ? ` + ${r.trailer.number}` : ''}
          </h1>
          <span className="text-lg text-muted">
            <TimeStamp iso={r.startedAt} timeZone={tz} />
          </span>
          {r.status === 'draft' && <span className="rounded border-2 border-edge px-2 font-bold">still walking</span>}
        </div>
        <dl className="grid grid-cols-2 gap-x-6 gap-y-3 md:grid-cols-4">
          <Fact label="Driver">{r.driverName}</Fact>
          <Fact label="Tractor">
            {r.tractor.number} {r.tractor.plate ? `· ${r.tractor.plate}` : ''}{' '}
            <UnitStatus status={r.tractor.status === 'out_of_service' ? 'out_of_service' : 'in_service'} />
          </Fact>
          <Fact label="Trailer">
            {r.trailer ? (
              <>
                {r.trailer.number}{' '}
                <UnitStatus status={r.trailer.status === 'out_of_service' ? 'out_of_service' : 'in_service'} />
              </>
            ) : (
              'none (bobtail)'
            )}
          </Fact>
          <Fact label="Odometer">{r.odometer === null ? '—' : `${r.odometer.toLocaleString('en-US')} mi`}</Fact>
          <Fact label="Started · finished">
            <TimeStamp iso={r.startedAt} timeZone={tz} format="time" /> ·{' '}
            <TimeStamp iso={r.finishedAt} timeZone={tz} format="time" />
          </Fact>
          <Fact label="Duration">
            {r.duration ? (
              <span className={r.duration.short ? 'font-extrabold text-minor' : ''} data-testid="duration">
                {formatDuration(r.durationS ?? r.duration.minutes * 60)} of {r.duration.minimumMinutes} min minimum
                {r.duration.short && (
                  <span className="block">
                    <SeverityMark severity="minor" label="shorter than the fleet minimum" />
                  </span>
                )}
              </span>
            ) : (
              '—'
            )}
          </Fact>
          <Fact label="Vocabulary">{r.vocabulary.label ?? '—'}</Fact>
          <Fact label="Location">{r.location ?? '—'}</Fact>
        </dl>
        <HashState hash={r.hash} />
        {r.skippedZones.length > 0 && (
          <p className="rounded border-2 border-minor p-2">
            <SeverityMark severity="minor" label="Zones not walked:" /> {r.skippedZones.map((z) => z.name).join(', ')}
          </p>
        )}
        {r.lowConfidenceUnconfirmed > 0 && (
          <p className="rounded border-2 border-minor p-2">
            <SeverityMark
              severity="minor"
              label={`${r.lowConfidenceUnconfirmed} unsure match(es) accepted without the driver confirming`}
            />
          </p>
        )}
      </Panel>

      <div className="grid gap-5 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <Panel as="section" aria-labelledby="defects-heading">
          <h2 id="defects-heading" className="mb-2 text-xl font-extrabold">
            Defects ({r.defects.length})
          </h2>
          {r.defects.length === 0 ? (
            <SeverityMark severity="pass" label="No defect found or reported" />
          ) : (
            <ul className="space-y-2">
              {r.defects.map((d) => (
                <li
                  key={d.id}
                  className={`rounded border-2 p-2 ${d.severity === 'major' ? 'border-l-8 border-major' : 'border-edge/30'}`}
                  data-testid="report-defect"
                >
                  <div className="flex flex-wrap items-baseline gap-x-3">
                    <SeverityMark severity={d.severity === 'major' ? 'major' : 'minor'} />
                    <span className="font-bold">{d.description}</span>
                    <span className="text-muted">unit {d.unitNumber}</span>
                    <Link href={`/mechanic/defects/${d.id}`} className="ml-auto text-sm font-bold underline">
                      {d.status === 'open' ? 'open: to the shop' : 'certification'}
                    </Link>
                  </div>
                  {d.status !== 'open' && (
                    <p className="text-sm">
                      <SeverityMark severity="pass" label={d.status === 'repaired' ? 'Repaired' : 'No repair needed'} />{' '}
                      by {d.certifiedName}, <TimeStamp iso={d.certifiedAt} timeZone={tz} />
                      {d.repairWork ? ` — ${d.repairWork}` : ''}
                    </p>
                  )}
                </li>
              ))}
            </ul>
          )}
          <h3 className="mt-4 mb-1 font-extrabold">Next driver&apos;s review (49 CFR 396.13)</h3>
          {r.acknowledgements.length ? (
            <ul className="text-base">
              {r.acknowledgements.map((a) => (
                <li key={a.id}>
                  {a.signatureName} signed for unit {a.unitNumber}, <TimeStamp iso={a.acknowledgedAt} timeZone={tz} />
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-muted">
              {r.defects.length
                ? 'Not reviewed by the next driver yet.'
                : 'No defect listed: no review signature needed.'}
            </p>
          )}
        </Panel>

        <aside className="space-y-4">
          <Panel as="section" aria-labelledby="review-heading">
            <h2 id="review-heading" className="mb-2 text-xl font-extrabold">
              Office review
            </h2>
            {r.review.reviewedAt && (
              <p className="mb-2" data-testid="review-state">
                <SeverityMark severity="pass" label="Reviewed" /> by {r.review.reviewerName},{' '}
                <TimeStamp iso={r.review.reviewedAt} timeZone={tz} />
              </p>
            )}
            <form
              onSubmit={(e) => {
                e.preventDefault();
                review.mutate({ note: note ?? r.review.note ?? '' });
              }}
              className="space-y-2"
            >
              <label className="block text-sm font-bold" htmlFor="review-note">
                Review note
              </label>
              <textarea
                id="review-note"
                rows={3}
                maxLength={2000}
                className="w-full rounded-md border-2 border-edge/50 bg-ground p-2 text-base"
                value={note ?? r.review.note ?? ''}
                onChange={(e) => setNote(e.target.value)}
              />
              <Button
                type="submit"
                tone="primary"
                size="compact"
                className="w-full"
                disabled={!live || review.isPending || r.status !== 'submitted'}
              >
                {review.isPending ? 'Saving…' : r.review.reviewedAt ? 'Update review' : 'Mark reviewed'}
              </Button>
              {review.error && (
                <p role="alert" className="font-bold text-major">
                  {review.error.message}
                </p>
              )}
              {review.isSuccess && <p role="status">Saved.</p>}
            </form>
          </Panel>
          <Panel as="section" aria-label="Printing and mail" className="space-y-2">
            <a
              href={`/api/reports/${r.id}/pdf`}
              target="_blank"
              rel="noreferrer"
              className={`${buttonClass('plain', 'compact')} w-full`}
            >
              Printable report (PDF)
            </a>
            {openDefects.length > 0 && (
              <Button
                size="compact"
                className="w-full"
                onClick={() => notify.mutate()}
                disabled={!live || notify.isPending}
              >
                {notify.isPending ? 'Sending…' : 'Mail the shop about open defects'}
              </Button>
            )}
            {notify.data && (
              <p role="status" className="text-sm">
                {notify.data.sent
                  .map(
                    (s) =>
                      `${s.kind === 'out_of_service' ? 'Out-of-service' : 'Repair-needed'} notice for unit ${s.unitNumber}${s.sent ? ' sent' : ' not sent'}`,
                  )
                  .join('; ')}
                .
              </p>
            )}
            {notify.error && (
              <p role="alert" className="text-sm font-bold text-major">
                {notify.error.message}
              </p>
            )}
            {openDefects.some((d) => d.severity === 'major') && (
              <p className="text-sm">
                <SeverityMark severity="major" /> — a major defect is open.
              </p>
            )}
          </Panel>
        </aside>
      </div>

      <Transcript report={r} />
    </article>
  );
}
