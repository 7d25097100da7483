'use client';

import { createColumnHelper } from '@tanstack/react-table';
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { fieldClass, pct } from '@/components/trainer/controls';
import { OpenDraftButton } from '@/components/trainer/open-draft-button';
import { useVersions } from '@/components/trainer/use-draft';
import { ApiError } from '@/lib/http/fetch-json';
import {
  testSetOptions,
  useEvaluationMutation,
  useImportGrammarMutation,
  usePublishMutation,
  useSaveTestSetMutation,
  type PublishResult,
} from '@/lib/queries/vocabulary';
import type { EvaluationLine, EvaluationReport, Figures } from '@/lib/schemas/vocabulary';
import { buttonClass } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';
import { Table } from '@/components/ui/table';

const grammarFiles = ['vocabulary', 'commands', 'positions', 'numbers', 'zones'] as const;

export function EvaluationClient() {
  const { list, draftSummary, publishedSummary } = useVersions();
  const [published, setPublished] = useState<PublishResult | null>(null);
  if (list.isPending) return <p className="text-muted">Loading…</p>;
  return (
    <div className="space-y-4">
      {published && (
        <p
          role="status"
          className="rounded-lg border-2 border-pass bg-panel px-4 py-2 text-lg font-bold"
          data-testid="published-notice"
        >
          <span className="text-pass">✓</span> Published “{published.version.label}”
          {published.override ? ' with an override (reason kept in the audit log)' : ''}: top-1{' '}
          {published.evaluation.figures.top1}/{published.evaluation.figures.total}, top-3{' '}
          {published.evaluation.figures.top3}/{published.evaluation.figures.total}. New inspections use it from now on.
        </p>
      )}
      <TestSetCard />
      {draftSummary ? (
        <DraftEvaluation
          key={draftSummary.id}
          id={draftSummary.id}
          label={draftSummary.label}
          onPublished={setPublished}
        />
      ) : (
        <div className={`${panelClass({ tone: 'quiet' })} flex items-center gap-3`}>
          <span>No draft is open{publishedSummary ? `; drivers use “${publishedSummary.label}”` : ''}.</span>
          <OpenDraftButton />
        </div>
      )}
      <GrammarFilesCard draftId={draftSummary?.id ?? null} publishedId={publishedSummary?.id ?? null} />
    </div>
  );
}

function TestSetCard() {
  const set = useQuery(testSetOptions());
  const save = useSaveTestSetMutation();
  const [picked, setPicked] = useState<{ name: string; jsonl: string } | null>(null);
  return (
    <section className={`${panelClass({ tone: 'quiet' })} flex flex-wrap items-center gap-4`} aria-label="Labelled set">
      <div className="mr-auto">
        <h2 className="text-lg font-extrabold">Labelled utterance set</h2>
        <p>
          {set.data ? (
            <>
              <b>{set.data.name}</b> · <span className="tabular-nums">{set.data.count}</span> lines ·{' '}
              {set.data.source === 'fleet' ? 'this fleet’s own' : 'the built-in set'}
            </>
          ) : (
            '…'
          )}
        </p>
      </div>
      <a className={buttonClass('plain', 'compact')} href="/api/vocabulary/test-set?format=jsonl">
        Export JSONL
      </a>
      <label className="flex items-center gap-2">
        <span className="text-sm font-bold">Import JSONL</span>
        <input
          type="file"
          accept=".jsonl,.ndjson,.txt,application/x-ndjson"
          className="text-sm"
          onChange={async (e) => {
            const file = e.target.files?.[0];
            if (file) setPicked({ name: file.name.replace(/\.[^.]+$/, ''), jsonl: await file.text() });
          }}
        />
      </label>
      {picked && (
        <button
          type="button"
          className={buttonClass('primary', 'compact')}
          disabled={save.isPending}
          onClick={() => save.mutate(picked, { onSuccess: () => setPicked(null) })}
        >
          Use “{picked.name}” as this fleet’s set
        </button>
      )}
      {save.error && (
        <p role="alert" className="w-full text-sm font-bold text-major">
          {save.error.message}
        </p>
      )}
    </section>
  );
}

function FigureCard({ title, figures, testId }: { title: string; figures: Figures; testId: string }) {
  return (
    <div className={panelClass({ tone: 'quiet' })} data-testid={testId}>
      <h3 className="text-sm font-bold tracking-wide text-muted uppercase">{title}</h3>
      <p className="text-3xl font-extrabold tabular-nums">{pct(figures.top1Rate)}</p>
      <p className="tabular-nums">
        top-1 {figures.top1}/{figures.total} · top-3 {figures.top3}/{figures.total} ({pct(figures.top3Rate)})
      </p>
    </div>
  );
}

const signed = (n: number) => (n > 0 ? `+${n}` : n === 0 ? '±0' : `−${Math.abs(n)}`);

function Difference({ report }: { report: EvaluationReport }) {
  if (!report.published)
    return (
      <div className={panelClass({ tone: 'quiet' })}>
        <h3 className="text-sm font-bold tracking-wide text-muted uppercase">Difference</h3>
        <p>Nothing published yet to compare with.</p>
      </div>
    );
  const d1 = report.figures.top1 - report.published.figures.top1;
  const d3 = report.figures.top3 - report.published.figures.top3;
  const worse = report.lowersAccuracy;
  return (
    <div
      className={`${panelClass({ tone: 'quiet' })} ${worse ? 'border-major' : ''}`}
      data-testid="evaluation-difference"
    >
      <h3 className="text-sm font-bold tracking-wide text-muted uppercase">
        Difference from “{report.published.label}”
      </h3>
      <p className="text-3xl font-extrabold tabular-nums">
        {worse ? '▼ ' : d1 > 0 ? '▲ ' : ''}
        {signed(d1)} top-1
      </p>
      <p className="tabular-nums">
        {signed(d3)} top-3 · {report.newlyFixed.length} newly right · {report.newlyMissed.length} newly missed
      </p>
      {worse && <p className="font-bold text-major">■ Lowers accuracy: publishing needs a reason.</p>}
    </div>
  );
}

const lineCol = createColumnHelper<EvaluationLine>();
const lineColumns = [
  lineCol.accessor('text', { header: 'Utterance', meta: { card: 'title' } }),
  lineCol.accessor((l) => l.zone?.replace(/_/g, ' ') ?? '—', { id: 'zone', header: 'Zone' }),
  lineCol.accessor('expected', { header: 'Labelled', cell: (c) => <code className="text-sm">{c.getValue()}</code> }),
  lineCol.accessor('got', {
    header: 'Read as',
    cell: ({ row: { original: l } }) => (
      <>
        <code className="text-sm">{l.got}</code>
        {l.top3 && <span className="ml-1 text-sm text-muted">(in top 3)</span>}
      </>
    ),
  }),
  lineCol.accessor('score', {
    header: 'Score',
    meta: { align: 'right', className: 'tabular-nums' },
    cell: (c) => c.getValue().toFixed(2),
  }),
];

function LineTable({ lines, caption }: { lines: EvaluationLine[]; caption: string }) {
  if (!lines.length) return null;
  return (
    <details className={panelClass({ tone: 'quiet' })} open={lines.length <= 12}>
      <summary className="cursor-pointer text-lg font-extrabold">
        {caption} ({lines.length})
      </summary>
      <Table
        label={caption}
        data={lines.slice(0, 200)}
        columns={lineColumns}
        getRowId={(l, i) => `${l.text}-${i}`}
        framed={false}
        density="dense"
        className="mt-2"
      />
    </details>
  );
}

function DraftEvaluation({
  id,
  label,
  onPublished,
}: {
  id: string;
  label: string;
  onPublished: (r: PublishResult) => void;
}) {
  const evaluation = useEvaluationMutation(id);
  const publish = usePublishMutation(id);
  const [reason, setReason] = useState('');
  const report = evaluation.data;
  const needsReason = report?.lowersAccuracy || (publish.error instanceof ApiError && publish.error.status === 409);
  return (
    <section className="space-y-3" aria-label="Evaluation">
      <div className={`${panelClass({ tone: 'quiet' })} flex flex-wrap items-center gap-3`}>
        <p className="mr-auto text-lg">
          Draft <b>{label}</b>
        </p>
        <button
          type="button"
          className={buttonClass('primary', 'compact')}
          disabled={evaluation.isPending}
          onClick={() => evaluation.mutate()}
        >
          {evaluation.isPending ? 'Running…' : 'Run the evaluation'}
        </button>
      </div>
      {evaluation.error && (
        <p role="alert" className="font-bold text-major">
          {evaluation.error.message}
        </p>
      )}
      {report && (
        <>
          <div className="grid gap-3 md:grid-cols-3">
            <FigureCard title={`Draft “${report.version.label}”`} figures={report.figures} testId="evaluation-draft" />
            {report.published ? (
              <FigureCard
                title={`Published “${report.published.label}”`}
                figures={report.published.figures}
                testId="evaluation-published"
              />
            ) : (
              <div className={panelClass({ tone: 'quiet' })}>No published version.</div>
            )}
            <Difference report={report} />
          </div>
          {report.otherSets && report.otherSets.length > 0 && (
            <div className="grid gap-3 md:grid-cols-3">
              {report.otherSets.map((o, i) => (
                <FigureCard
                  key={o.name}
                  title={`Draft on the ${o.name}`}
                  figures={o.figures}
                  testId={`evaluation-other-${i}`}
                />
              ))}
            </div>
          )}
          <LineTable lines={report.newlyMissed} caption="Newly missed by the draft" />
          <LineTable lines={report.newlyFixed} caption="Newly right in the draft" />
          <LineTable lines={report.misses} caption="All misses of the draft" />
        </>
      )}
      <div className={`${panelClass({ tone: 'quiet' })} space-y-2`} aria-label="Publish">
        <h2 className="text-lg font-extrabold">Publish</h2>
        <p>
          New inspections use the published version from the moment it is published; inspections already started keep
          theirs. A published version cannot be changed.
        </p>
        <>
          {needsReason && (
            <label className="block">
              <span className="block text-sm font-bold">
                Why publish a draft that scores lower? (kept in the audit log)
              </span>
              <textarea
                className={`${fieldClass} min-h-20`}
                value={reason}
                onChange={(e) => setReason(e.target.value)}
                maxLength={500}
              />
            </label>
          )}
          <div className="flex flex-wrap gap-2">
            {needsReason ? (
              <button
                type="button"
                className={buttonClass('danger', 'compact')}
                disabled={reason.trim().length < 10 || publish.isPending}
                onClick={() =>
                  publish.mutateAsync({ override: { reason: reason.trim() } }).then(onPublished, () => undefined)
                }
              >
                Publish anyway, with this reason
              </button>
            ) : (
              <button
                type="button"
                className={buttonClass('primary', 'compact')}
                disabled={publish.isPending}
                onClick={() => publish.mutateAsync({}).then(onPublished, () => undefined)}
              >
                Publish the draft
              </button>
            )}
          </div>
          {publish.error && (
            <p role="alert" className="text-sm font-bold text-major">
              {publish.error.message}
            </p>
          )}
        </>
      </div>
    </section>
  );
}

function GrammarFilesCard({ draftId, publishedId }: { draftId: string | null; publishedId: string | null }) {
  const importer = useImportGrammarMutation();
  const [message, setMessage] = useState<string | null>(null);
  return (
    <section className={`${panelClass({ tone: 'quiet' })} space-y-2`} aria-label="Grammar files">
      <h2 className="text-lg font-extrabold">Grammar files</h2>
      <p className="text-sm text-muted">
        The same format as the grammars/ folder: export a version’s files, or import files into the draft.
      </p>
      {[
        ['Draft', draftId],
        ['Published', publishedId],
      ].map(([name, id]) =>
        id ? (
          <p key={name} className="flex flex-wrap items-center gap-2">
            <span className="w-24 font-bold">{name}</span>
            {grammarFiles.map((f) => (
              <a key={f} className="underline" href={`/api/vocabulary/versions/${id}/export?file=${f}`}>
                {f}.json
              </a>
            ))}
            <a className="underline" href={`/api/vocabulary/versions/${id}/export`}>
              all in one
            </a>
          </p>
        ) : null,
      )}
      <label className="flex flex-wrap items-center gap-2">
        <span className="w-24 font-bold">Import</span>
        <input
          type="file"
          multiple
          accept=".json,application/json"
          className="text-sm"
          onChange={async (e) => {
            const files: Record<string, unknown> = {};
            try {
              for (const file of Array.from(e.target.files ?? [])) {
                const json = JSON.parse(await file.text()) as Record<string, unknown>;
                const base = file.name.replace(/\.json$/i, '');
                if ((grammarFiles as readonly string[]).includes(base)) files[base] = json;
                else for (const f of grammarFiles) if (f in json) files[f] = json[f];
              }
            } catch {
              setMessage('That file is not JSON.');
              return;
            }
            importer.mutate(
              { files },
              { onSuccess: (r) => setMessage(`Imported ${r.files.join(', ')} into draft “${r.version.label}”.`) },
            );
          }}
        />
      </label>
      {message && <p role="status">{message}</p>}
      {importer.error && (
        <p role="alert" className="text-sm font-bold text-major">
          {importer.error.message}
        </p>
      )}
    </section>
  );
}
