'use client';

import { createColumnHelper } from '@tanstack/react-table';
import { useMemo } from 'react';
import { formatDuration } from '@/components/office/format';
import { EmptyState } from '@/components/ui/empty-state';
import { Panel } from '@/components/ui/panel';
import { SeverityMark } from '@/components/ui/severity-mark';
import { Table } from '@/components/ui/table';
import { TimeStamp } from '@/components/ui/time-stamp';
import type { ReportDetail } from '@/lib/schemas/reports';
import {
  formatLimitText,
  formatQuantity,
  idWords,
  joinName,
  nameFinding,
  sourceWords,
  statusWords,
} from '@/lib/walk/name-finding';

type Step = ReportDetail['zones'][number]['steps'][number];

const kindWords: Record<string, string> = {
  visit: 'zone opened',
  zone_ok: 'zone all good',
  ok: 'OK',
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
  return low ? <SeverityMark severity="minor" label="accepted unconfirmed" /> : <span>first try</span>;
}

/** What a step named: the item's words from its id ("front.steer_tread" → "steer tread"). */
const itemWords = (item: string | null) => (item ? idWords(item.split('.').at(-1) ?? item) : null);

function Match({ s }: { s: Step }) {
  if (s.kind === 'measurement')
    return (
      <span>
        <span className="font-bold">{formatQuantity(s.value, s.unit)}</span>{' '}
        {joinName([s.component, s.measurementKind]) || itemWords(s.item) || 'reading'} ·{' '}
        {s.verdict === 'fail' ? (
          <SeverityMark severity={s.severity === 'major' ? 'major' : 'minor'} compact />
        ) : (
          <SeverityMark severity="pass" />
        )}
        <span className="block text-sm text-muted">
          limit {formatLimitText(s.limitText)} · {sourceWords(s.source)}
        </span>
      </span>
    );
  if (s.kind === 'defect')
    return (
      <span>
        <span className="font-bold">
          {nameFinding({ component: s.component, condition: s.condition, position: s.position })}
        </span>{' '}
        <SeverityMark severity={s.severity === 'major' ? 'major' : 'minor'} compact />
      </span>
    );
  const item = itemWords(s.item);
  return (
    <span className="text-muted">
      {kindWords[s.kind] ?? statusWords(s.kind)}
      {item ? `: ${item}` : ''}
    </span>
  );
}

const col = createColumnHelper<Step>();

// Sizes add up to the table's 820 px minimum; wider, the browser widens every column in proportion.
const makeColumns = (timeZone: string) => [
  col.accessor('deviceAt', {
    header: 'Time',
    size: 104,
    meta: { className: 'tabular-nums', card: 'title' },
    cell: (c) => <TimeStamp iso={c.getValue()} timeZone={timeZone} format="time" viewerClock={false} />,
  }),
  col.accessor('heard', {
    header: 'Heard',
    size: 140,
    cell: ({ row: { original: s } }) =>
      s.heard ? (
        <q className="text-base">{s.heard}</q>
      ) : (
        <span className="text-muted">{s.inputMode === 'tap' ? 'tapped' : '—'}</span>
      ),
  }),
  col.accessor((s) => s.alternatives.join(' · '), {
    id: 'alternatives',
    header: 'Other readings',
    size: 90,
    meta: { className: 'text-muted', card: 'hidden' },
  }),
  col.display({ id: 'match', header: 'Matched / measured', size: 250, cell: ({ row }) => <Match s={row.original} /> }),
  col.accessor('score', {
    header: 'Score',
    size: 48,
    meta: { align: 'right', className: 'tabular-nums' },
    cell: (c) => (c.getValue() === null ? '' : c.getValue()?.toFixed(2)),
  }),
  col.display({ id: 'settled', header: 'Settled', size: 110, cell: ({ row }) => <Resolution s={row.original} /> }),
  col.display({
    id: 'photos',
    header: 'Photos',
    size: 78,
    cell: ({ row: { original: s } }) =>
      s.photos.map((p) =>
        p.url ? (
          <a key={p.id} href={p.url} target="_blank" rel="noreferrer">
            {/* eslint-disable-next-line @next/next/no-img-element -- a signed URL from our own store, sized by the server */}
            <img
              src={`${p.url}?size=thumb`}
              alt={`Photo of ${s.component ? joinName([s.component]) : 'the finding'}`}
              className="h-12 w-16 rounded border border-edge object-cover"
            />
          </a>
        ) : null,
      ),
  }),
];

export function Transcript({ report }: { report: ReportDetail }) {
  const columns = useMemo(() => makeColumns(report.timezone), [report.timezone]);
  return (
    <Panel as="section" padding="none" aria-labelledby="transcript-heading">
      <header className="flex flex-wrap items-baseline justify-between gap-2 border-b-2 border-edge/20 px-4 py-3">
        <h2 id="transcript-heading" className="text-xl font-extrabold">
          Transcript of findings
        </h2>
        <p className="text-sm text-muted">
          what was heard, what it matched and how sure · zone by zone with time spent
        </p>
      </header>
      {report.zones.length === 0 && <EmptyState title="No step recorded." />}
      {report.zones.map((z) => (
        <section
          key={z.id}
          aria-label={`Zone ${z.name}`}
          className="border-t-2 border-edge/20 first:border-t-0 max-sm:pb-1"
          data-testid="transcript-zone"
        >
          <h3 className="flex items-baseline gap-3 bg-ground px-4 py-1.5 font-extrabold capitalize">
            {z.name}
            <span className="text-sm font-bold text-muted normal-case">{formatDuration(z.seconds)} in zone</span>
          </h3>
          <Table
            label={`Steps in zone ${z.name}`}
            data={z.steps}
            columns={columns}
            getRowId={(s) => s.id}
            enableSorting={false}
            framed={false}
            wide
            density="dense"
            tableClassName="sm:min-w-[820px] sm:table-fixed"
            rowProps={(s) => ({
              'data-testid': `step-${s.kind}`,
              className: s.kind === 'defect' || s.verdict === 'fail' ? 'bg-ground/60' : undefined,
            })}
          />
        </section>
      ))}
    </Panel>
  );
}
