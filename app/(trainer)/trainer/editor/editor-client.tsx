'use client';

import { useEffect, useMemo, useState } from 'react';
import { OpenDraftButton } from '@/components/trainer/open-draft-button';
import { useVersions } from '@/components/trainer/use-draft';
import { useSaveDraftMutation } from '@/lib/queries/vocabulary';
import type { Grammar } from '@/lib/schemas/grammar';
import { listGrammarProblems } from '@/lib/schemas/vocabulary';
import { ConditionsPane } from './conditions-pane';
import { TermsPane } from './terms-pane';
import { ZonesPane } from './zones-pane';
import { buttonClass } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';
import { panelId, tabId, Tabs } from '@/components/ui/tabs';

export type EditFn = (change: (g: Grammar) => void) => void;

const tabs = [
  { id: 'terms', label: 'Systems & components' },
  { id: 'conditions', label: 'Conditions' },
  { id: 'zones', label: 'Zone checklists' },
] as const;

export function EditorClient() {
  const { list, draftSummary, draft, draftLoading } = useVersions({ withGrammar: true });
  if (list.isPending || draftLoading) return <p className="text-muted">Loading the draft…</p>;
  if (!draftSummary || !draft) {
    return (
      <div className={`${panelClass({ tone: 'quiet' })} space-y-3`}>
        <p className="text-lg">Edits are made in a draft. Published versions never change.</p>
        <OpenDraftButton />
      </div>
    );
  }
  return (
    <DraftEditor key={draft.id} id={draft.id} label={draft.label} saved={draft.grammar} updatedAt={draft.updatedAt} />
  );
}

function DraftEditor({
  id,
  label,
  saved,
  updatedAt,
}: {
  id: string;
  label: string;
  saved: Grammar;
  updatedAt: string;
}) {
  const [grammar, setGrammar] = useState(saved);
  const [dirty, setDirty] = useState(false);
  const [tab, setTab] = useState<(typeof tabs)[number]['id']>('terms');
  const [conditionFocus, setConditionFocus] = useState<string | null>(null);
  const save = useSaveDraftMutation(id);
  useEffect(() => {
    if (!dirty) setGrammar(saved);
  }, [saved, updatedAt, dirty]);
  const edit: EditFn = (change) => {
    setGrammar((prev) => {
      const next = structuredClone(prev);
      change(next);
      return next;
    });
    setDirty(true);
  };
  const problems = useMemo(() => listGrammarProblems(grammar), [grammar]);
  return (
    <div className="space-y-3">
      <div className="sticky top-0 z-10 flex flex-wrap items-center gap-3 rounded-lg border-2 border-edge/30 bg-panel px-4 py-2">
        <p className="mr-auto">
          Editing draft <span className="font-bold">{label}</span>{' '}
          <span className="text-sm text-muted" data-testid="save-state">
            {save.isPending ? 'saving…' : dirty ? '● unsaved changes' : '✓ saved'}
          </span>
        </p>
        {problems.length > 0 && <span className="text-sm font-bold text-major">▲ {problems[0]}</span>}
        {save.error && (
          <span role="alert" className="text-sm font-bold text-major">
            {save.error.message}
          </span>
        )}
        <button
          type="button"
          className={buttonClass('plain', 'compact')}
          disabled={!dirty || save.isPending}
          onClick={() => {
            setGrammar(saved);
            setDirty(false);
          }}
        >
          Discard
        </button>
        <button
          type="button"
          className={buttonClass('primary', 'compact')}
          disabled={!dirty || save.isPending || problems.length > 0}
          onClick={() =>
            save.mutateAsync({ grammar, baseUpdatedAt: updatedAt }).then(
              () => setDirty(false),
              () => undefined,
            )
          }
        >
          Save draft
        </button>
      </div>
      <Tabs
        label="Editor sections"
        idPrefix="editor"
        items={[...tabs]}
        value={tab}
        onChange={setTab}
        className="border-b-2 border-edge/20 pb-2"
      />
      <div role="tabpanel" id={panelId('editor', tab)} aria-labelledby={tabId('editor', tab)}>
        {tab === 'terms' && (
          <TermsPane
            grammar={grammar}
            edit={edit}
            onOpenCondition={(cid) => {
              setConditionFocus(cid);
              setTab('conditions');
            }}
          />
        )}
        {tab === 'conditions' && <ConditionsPane grammar={grammar} edit={edit} focus={conditionFocus} />}
        {tab === 'zones' && <ZonesPane grammar={grammar} edit={edit} />}
      </div>
    </div>
  );
}
