'use client';

import { useQuery } from '@tanstack/react-query';
import Link from 'next/link';
import { formatDateTime } from '@/components/office/format';
import { useHydrated } from '@/components/ui/use-hydrated';
import { buttonClass, cardClass } from '@/components/trainer/controls';
import { OpenDraftButton } from '@/components/trainer/open-draft-button';
import { useVersions } from '@/components/trainer/use-draft';
import { inboxOptions } from '@/lib/queries/vocabulary';

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
      <section className={cardClass} aria-labelledby="versions-title">
        <h2 id="versions-title" className="mb-3 text-xl font-extrabold">
          Versions
        </h2>
        <table className="w-full text-left text-base">
          <thead className="border-b-2 border-edge/30 text-sm tracking-wide text-muted uppercase">
            <tr>
              <th className="py-1.5 pr-3">Label</th>
              <th className="py-1.5 pr-3">State</th>
              <th className="py-1.5 pr-3">Published</th>
              <th className="py-1.5 pr-3 text-right">Inspections</th>
              <th className="py-1.5">Export</th>
            </tr>
          </thead>
          <tbody>
            {versions.map((v) => (
              <tr key={v.id} className="border-b border-edge/15" data-testid="version-row">
                <td className="py-2 pr-3 font-bold">{v.label}</td>
                <td className="py-2 pr-3">
                  {v.status === 'draft' ? (
                    <span className="rounded border-2 border-dashed border-edge/60 px-1.5 text-sm font-bold">
                      ✎ DRAFT
                    </span>
                  ) : v.id === publishedSummary?.id ? (
                    <span className="rounded bg-vest px-1.5 text-sm font-bold text-on-vest">● IN USE</span>
                  ) : (
                    <span className="text-sm text-muted">published, replaced</span>
                  )}
                </td>
                <td className="py-2 pr-3 text-sm">
                  {v.publishedAt
                    ? `${formatDateTime(v.publishedAt, tz)}${v.publishedBy ? ` · ${v.publishedBy}` : ''}`
                    : '—'}
                </td>
                <td className="py-2 pr-3 text-right tabular-nums">{v.inspections}</td>
                <td className="py-2 text-sm">
                  <a className="underline" href={`/api/vocabulary/versions/${v.id}/export`}>
                    grammar
                  </a>{' '}
                  ·{' '}
                  <a className="underline" href={`/api/vocabulary/versions/${v.id}/export?file=vocabulary`}>
                    vocabulary.json
                  </a>
                </td>
              </tr>
            ))}
            {versions.length === 0 && (
              <tr>
                <td colSpan={5} className="py-3 text-muted">
                  No version yet: drivers use the built-in vocabulary. Open a draft to start.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </section>
      <aside className="space-y-4">
        <section className={cardClass}>
          <h2 className="mb-2 text-xl font-extrabold">Draft</h2>
          {draftSummary ? (
            <div className="space-y-2">
              <p>
                <span className="font-bold">{draftSummary.label}</span>{' '}
                <span className="text-sm text-muted">last saved {formatDateTime(draftSummary.updatedAt, tz)}</span>
              </p>
              <div className="flex flex-wrap gap-2">
                <Link className={buttonClass('primary')} href="/trainer/editor">
                  Edit the draft
                </Link>
                <Link className={buttonClass()} href="/trainer/evaluation">
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
        <section className={cardClass}>
          <h2 className="mb-2 text-xl font-extrabold">Field utterances</h2>
          <p className="text-lg">
            <span className="text-3xl font-extrabold tabular-nums" data-testid="inbox-count">
              {inbox.data?.total ?? '…'}
            </span>{' '}
            waiting, in {inbox.data?.groups.length ?? '…'} groups
          </p>
          <Link className={`${buttonClass()} mt-2`} href="/trainer/inbox">
            Open the inbox
          </Link>
        </section>
      </aside>
    </div>
  );
}
