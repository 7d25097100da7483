'use client';

import { useQuery } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { formatDateTime } from '@/components/office/format';
import { useHydrated } from '@/components/ui/use-hydrated';
import { chipClass, fieldClass } from '@/components/trainer/controls';
import { OpenDraftButton } from '@/components/trainer/open-draft-button';
import { useVersions } from '@/components/trainer/use-draft';
import {
  inboxOptions,
  useAddPhraseMutation,
  useDismissUtterancesMutation,
  type AddPhraseResult,
} from '@/lib/queries/vocabulary';
import type { FieldUtteranceGroup } from '@/lib/schemas/vocabulary';
import { buttonClass } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';

const outcomeWords: Record<string, string> = {
  unmatched: 'matched nothing',
  low_score: 'unsure match',
  corrected: 'corrected by the driver',
};

export function InboxClient() {
  const inbox = useQuery(inboxOptions());
  const [notice, setNotice] = useState<(AddPhraseResult & { heard: string }) | null>(null);
  const { draftSummary, draft } = useVersions({ withGrammar: true });
  const terms = useMemo(() => {
    const out = new Map<string, string>();
    if (!draft) return out;
    const cond = new Map(draft.grammar.vocabulary.conditions.map((c) => [c.id, c.name]));
    for (const c of draft.grammar.vocabulary.components)
      for (const d of c.defects)
        out.set(`${c.name}, ${cond.get(d.condition) ?? d.condition}`, `${c.id}:${d.condition}`);
    return out;
  }, [draft]);
  if (inbox.isPending) return <p className="text-muted">Loading the inbox…</p>;
  if (inbox.error)
    return (
      <p role="alert" className="font-bold text-major">
        {inbox.error.message}
      </p>
    );
  const groups = inbox.data.groups;
  return (
    <div className="space-y-3">
      <p className="text-lg">
        What drivers said that matched nothing, matched unsurely, or that they corrected:{' '}
        <b className="tabular-nums">{inbox.data.total}</b> utterances in <b className="tabular-nums">{groups.length}</b>{' '}
        groups of similar text. Adding one as a phrase changes the draft only; drivers get it when the draft is
        published.
      </p>
      {!draftSummary && (
        <div className={`${panelClass({ tone: 'quiet' })} flex items-center gap-3`}>
          <span>Phrases go into a draft.</span>
          <OpenDraftButton />
        </div>
      )}
      {notice && (
        <p
          className="rounded-lg border-2 border-pass bg-panel px-4 py-2 text-base"
          role="status"
          data-testid="phrase-added"
        >
          <span className="font-bold text-pass">✓</span> “{notice.heard}”: added “<b>{notice.phrase}</b>” to{' '}
          {notice.slot} <b>{notice.target}</b>. The draft now reads it as <b>{notice.match.label}</b> (score{' '}
          {notice.match.score.toFixed(2)}).
        </p>
      )}
      <datalist id="term-options">
        {[...terms.keys()].map((label) => (
          <option key={label} value={label} />
        ))}
      </datalist>
      {groups.length === 0 && <p className={panelClass({ tone: 'quiet' })}>The inbox is empty.</p>}
      <ul className="space-y-2">
        {groups.map((g) => (
          <InboxGroup
            key={g.key}
            group={g}
            draftId={draft?.id ?? null}
            terms={terms}
            onAdded={(r) => setNotice({ ...r, heard: g.text })}
          />
        ))}
      </ul>
    </div>
  );
}

function InboxGroup({
  group,
  draftId,
  terms,
  onAdded,
}: {
  group: FieldUtteranceGroup;
  draftId: string | null;
  terms: Map<string, string>;
  onAdded: (r: AddPhraseResult) => void;
}) {
  const hydrated = useHydrated();
  const [term, setTerm] = useState(group.suggestion?.label ?? '');
  const add = useAddPhraseMutation(draftId ?? 'none');
  const dismiss = useDismissUtterancesMutation();
  const termKey = terms.get(term.trim()) ?? null;
  return (
    <li className={`${panelClass({ tone: 'quiet' })} grid gap-3 lg:grid-cols-[1fr_26rem]`} data-testid="inbox-group">
      <div className="space-y-1">
        <p className="text-xl font-bold">
          “{group.text}”{' '}
          <span className="ml-2 rounded bg-ink px-2 py-0.5 text-base text-ground tabular-nums" title="times heard">
            ×{group.count}
          </span>
        </p>
        {group.variants.length > 1 && (
          <ul className="flex flex-wrap gap-1.5" aria-label="Similar">
            {group.variants.slice(1, 6).map((v) => (
              <li key={v.text} className={chipClass}>
                {v.text} {v.count > 1 && <b>×{v.count}</b>}
              </li>
            ))}
          </ul>
        )}
        <p className="text-sm text-muted">
          {Object.entries(group.outcomes)
            .map(([k, n]) => `${n} ${outcomeWords[k] ?? k}`)
            .join(' · ')}
          {group.zones.length > 0 && ` · ${group.zones.map((z) => z.replace(/_/g, ' ')).join(', ')}`} · last{' '}
          {formatDateTime(group.lastSeen, hydrated ? undefined : 'UTC')}
        </p>
      </div>
      <div className="space-y-2">
        <>
          <label className="block">
            <span className="block text-sm font-bold">Term (component, condition)</span>
            <input
              className={fieldClass}
              list="term-options"
              value={term}
              onChange={(e) => setTerm(e.target.value)}
              placeholder="type to find a term"
              aria-label={`Term for “${group.text}”`}
            />
          </label>
          <div className="flex flex-wrap gap-2">
            <button
              type="button"
              className={buttonClass('primary', 'compact')}
              disabled={!draftId || !termKey || add.isPending}
              onClick={() => {
                // The group leaves the list once resolved, so the notice is raised by the list.
                if (termKey)
                  add
                    .mutateAsync({ termKey, text: group.text, utteranceIds: group.ids })
                    .then(onAdded, () => undefined);
              }}
            >
              Add as phrase of {termKey ? term : 'this term'}
            </button>
            <button
              type="button"
              className={buttonClass('plain', 'compact')}
              disabled={dismiss.isPending}
              onClick={() => dismiss.mutate(group.ids)}
            >
              Dismiss
            </button>
          </div>
          {add.error && (
            <p role="alert" className="text-sm font-bold text-major">
              {add.error.message}
            </p>
          )}
        </>
      </div>
    </li>
  );
}
