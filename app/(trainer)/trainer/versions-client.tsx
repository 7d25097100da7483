'use client';

import { useQuery } from '@tanstack/react-query';
import { createColumnHelper } from '@tanstack/react-table';
import Link from 'next/link';
import { formatDateTime } from '@/components/office/format';
import { useHydrated } from '@/components/ui/use-hydrated';
import { OpenDraftButton } from '@/components/trainer/open-draft-button';
import { useVersions } from '@/components/trainer/use-draft';
import { inboxOptions } from '@/lib/queries/vocabulary';
import { buttonClass } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { panelClass } from '@/components/ui/panel';
import { Table } from '@/components/ui/table';
import { TimeStamp } from '@/components/ui/time-stamp';

type Version = ReturnType<typeof useVersions>['versions'][number];
const col = createColumnHelper<Version>();

const makeColumns = (inUseId: string | undefined) => [
  col.accessor('label', { header: 'Label', meta: { className: 'font-bold', card: 'title' } }),
  col.accessor('status', {
    header: 'State',
    cell: ({ row: { original: v } }) =>
      v.status === 'draft' ? (
        <span className="rounded border-2 border-dashed border-edge/60 px-1.5 text-sm font-bold">✎ DRAFT</span>
      ) : v.id === inUseId ? (
        <span className="rounded bg-vest px-1.5 text-sm font-bold text-on-vest">● IN USE</span>
      ) : (
        <span className="text-sm text-muted">published, replaced</span>
      ),
  }),
  col.accessor('publishedAt', {
    header: 'Published',
    meta: { className: 'text-sm' },
    cell: ({ row: { original: v } }) =>
      v.publishedAt ? (
        <>
          <TimeStamp iso={v.publishedAt} />
          {v.publishedBy ? ` · ${v.publishedBy}` : ''}
        </>
      ) : (
        '—'
      ),
  }),
  col.accessor('inspections', { header: 'Inspections', meta: { align: 'right', className: 'tabular-nums' } }),
  col.display({
    id: 'export',
    header: 'Export',
    meta: { className: 'text-sm' },
    cell: ({ row: { original: v } }) => (
      <>
        <a className="underline" href={`/api/vocabulary/versions/${v.id}/export`}>
          grammar
        </a>{' '}
        ·{' '}
        <a className="underline" href={`/api/vocabulary/versions/${v.id}/export?file=vocabulary`}>
          vocabulary.json
        </a>
      </>
    ),
  }),
];

export function VersionsClient() {
  const hydrated = useHydrated();
  const { list, versions, draftSummary, publishedSummary } = useVersions();
  const inbox = useQuery(inboxOptions());
  if (list.isPending) return <p className="text-muted">Loading versions…</p>;
  if (list.error)
    return (
      <p role="alert" className="font-bold text-major">
        {list.error.message}
      </p>
    );
  const tz = hydrated ? undefined : 'UTC';
  return (
    <div className="grid gap-4 lg:grid-cols-[2fr_1fr]">
      <section className={panelClass({ tone: 'quiet' })} aria-labelledby="versions-title">
        <h2 id="versions-title" className="mb-3 text-xl font-extrabold">
          Versions
        </h2>
        <Table
          label="Versions"
          data={versions}
          columns={makeColumns(publishedSummary?.id)}
          getRowId={(v) => v.id}
          framed={false}
          rowProps={() => ({ 'data-testid': 'version-row' })}
          empty={
            <EmptyState title="No version yet: drivers use the built-in vocabulary." className="px-0">
              Open a draft to start.
            </EmptyState>
          }
        />
      </section>
      <aside className="space-y-4">
        <section className={panelClass({ tone: 'quiet' })}>
          <h2 className="mb-2 text-xl font-extrabold">Draft</h2>
          {draftSummary ? (
            <div className="space-y-2">
              <p>
                <span className="font-bold">{draftSummary.label}</span>{' '}
                <span className="text-sm text-muted">last saved {formatDateTime(draftSummary.updatedAt, tz)}</span>
              </p>
              <div className="flex flex-wrap gap-2">
                <Link className={buttonClass('primary', 'compact')} href="/trainer/editor">
                  Edit the draft
                </Link>
                <Link className={buttonClass('plain', 'compact')} href="/trainer/evaluation">
                  Evaluate &amp; publish
                </Link>
              </div>
            </div>
          ) : (
            <div className="space-y-2">
              <p className="text-muted">
                No draft is open. A draft starts as a copy of{' '}
                {publishedSummary ? `“${publishedSummary.label}”` : 'the built-in vocabulary'}.
              </p>
              <OpenDraftButton />
            </div>
          )}
        </section>
        <section className={panelClass({ tone: 'quiet' })}>
          <h2 className="mb-2 text-xl font-extrabold">Field utterances</h2>
          <p className="text-lg">
            <span className="text-3xl font-extrabold tabular-nums" data-testid="inbox-count">
              {inbox.data?.total ?? '…'}
            </span>{' '}
            waiting, in {inbox.data?.groups.length ?? '…'} groups
          </p>
          <Link className={`${buttonClass('plain', 'compact')} mt-2`} href="/trainer/inbox">
            Open the inbox
          </Link>
        </section>
      </aside>
    </div>
  );
}
