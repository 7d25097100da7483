'use client';

import { formatDuration, formatTime } from '@/components/office/format';
import { MinorMark, PassMark, SeverityMark } from '@/components/office/severity-mark';
import type { ReportDetail } from '@/lib/schemas/reports';

type Step = ReportDetail['zones'][number]['steps'][number];

const kindWords: Record<string, string> = {
  visit: 'zone opened',
  zone_ok: 'zone all good',
  ok: 'item OK',
  defect: 'finding',
  measurement: 'measurement',
  undo: 'undo',
  note: 'note',
  photo: 'photo',
};

function Resolution({ s }: { s: Step }) {
  if (!s.resolution) return <span className="text-muted">{s.inputMode}</span>;
  const low = s.score !== null && s.score < 0.8;
  if (s.resolution === 'corrected') return <span className="font-bold">corrected by driver</span>;
  if (s.resolution === 'confirmed') return <span className="font-bold">confirmed by driver</span>;
  return low ? <MinorMark label="accepted unconfirmed" /> : <span>first try</span>;
}

function Match({ s }: { s: Step }) {
  if (s.kind === 'measurement')
    return (
      <span>
        <span className="font-bold">
          {s.value ?? '—'} {s.unit}
        </span>{' '}
        {s.measurementKind?.replace(/_/g, ' ')} ·{' '}
        {s.verdict === 'fail' ? (
          <SeverityMark severity={s.severity === 'major' ? 'major' : 'minor'} compact />
        ) : (
          <PassMark />
        )}
        <span className="block text-sm text-muted">
          limit {s.limitText ?? '—'} · {s.source ?? 'no source'}
        </span>
      </span>
    );
  if (s.kind === 'defect')
    return (
      <span>
        <span className="font-bold">
          {s.component}, {s.condition}
          {s.position ? `, ${s.position}` : ''}
        </span>{' '}
        <SeverityMark severity={s.severity === 'major' ? 'major' : 'minor'} compact />
        {s.termKey && <span className="block font-mono text-sm text-muted">{s.termKey}</span>}
      </span>
    );
  return <span className="text-muted">{kindWords[s.kind] ?? s.kind}</span>;
}

export function Transcript({ report }: { report: ReportDetail }) {
  return (
    <section aria-labelledby="transcript-heading" className="rounded-lg border-slab border-edge bg-panel">
      <header className="flex flex-wrap items-baseline justify-between gap-2 border-b-2 border-edge/20 px-4 py-3">
        <h2 id="transcript-heading" className="text-xl font-extrabold">
          Transcript of findings
        </h2>
        <p className="text-sm text-muted">
          what was heard, what it matched and how sure · zone by zone with time spent
        </p>
      </header>
      {report.zones.length === 0 && <p className="p-4 text-muted">No step recorded.</p>}
      {report.zones.map((z) => (
        <section
          key={z.id}
          aria-label={`Zone ${z.name}`}
          className="border-t-2 border-edge/20 first:border-t-0"
          data-testid="transcript-zone"
        >
          <h3 className="flex items-baseline gap-3 bg-ground px-4 py-1.5 font-extrabold capitalize">
            {z.name}
            <span className="text-sm font-bold text-muted normal-case">{formatDuration(z.seconds)} in zone</span>
          </h3>
          {/* Wider than a phone: a named stop in the tab order, so a keyboard can scroll it. */}
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label={`Steps in zone ${z.name}`}>
            <table className="w-full min-w-[820px] table-fixed text-sm">
              <thead className="text-left tracking-wide text-muted uppercase">
                <tr>
                  <th className="w-20 px-4 py-1">Time</th>
                  <th className="w-[22%] px-2 py-1">Heard</th>
                  <th className="w-[16%] px-2 py-1">Other readings</th>
                  <th className="px-2 py-1">Matched / measured</th>
                  <th className="w-16 px-2 py-1 text-right">Score</th>
                  <th className="w-36 px-2 py-1">Settled</th>
                  <th className="w-24 px-4 py-1">Photos</th>
                </tr>
              </thead>
              <tbody>
                {z.steps.map((s) => (
                  <tr
                    key={s.id}
                    className={`border-t border-edge/10 align-top ${s.kind === 'defect' || s.verdict === 'fail' ? 'bg-ground/60' : ''}`}
                    data-testid={`step-${s.kind}`}
                  >
                    <td className="px-4 py-1 tabular-nums">{formatTime(s.deviceAt, report.timezone)}</td>
                    <td className="px-2 py-1">
                      {s.heard ? (
                        <q className="text-base">{s.heard}</q>
                      ) : (
                        <span className="text-muted">{s.inputMode === 'tap' ? 'tapped' : '—'}</span>
                      )}
                    </td>
                    <td className="px-2 py-1 text-muted">{s.alternatives.length ? s.alternatives.join(' · ') : ''}</td>
                    <td className="px-2 py-1">
                      <Match s={s} />
                    </td>
                    <td className="px-2 py-1 text-right tabular-nums">{s.score === null ? '' : s.score.toFixed(2)}</td>
                    <td className="px-2 py-1">
                      <Resolution s={s} />
                    </td>
                    <td className="px-4 py-1">
                      {s.photos.map((p) =>
                        p.url ? (
                          <a key={p.id} href={p.url} target="_blank" rel="noreferrer">
                            {/* eslint-disable-next-line @next/next/no-img-element */}
                            <img
                              src={`${p.url}?size=thumb`}
                              alt={`Photo of ${s.component ?? 'the finding'}`}
                              className="h-12 w-16 rounded border border-edge object-cover"
                            />
                          </a>
                        ) : null,
                      )}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </section>
      ))}
    </section>
  );
}
