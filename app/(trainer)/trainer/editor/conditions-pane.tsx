'use client';

import { useState } from 'react';
import { fieldClass } from '@/components/trainer/controls';
import { PhraseList } from '@/components/trainer/phrase-list';
import type { Grammar } from '@/lib/schemas/grammar';
import type { EditFn } from './editor-client';
import { buttonClass } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';

const toId = (s: string) =>
  s
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '_')
    .replace(/^_|_$/g, '');

export function ConditionsPane({ grammar, edit, focus }: { grammar: Grammar; edit: EditFn; focus: string | null }) {
  const v = grammar.vocabulary;
  const [selectedId, setSelectedId] = useState<string | null>(focus ?? v.conditions[0]?.id ?? null);
  const [newName, setNewName] = useState('');
  const selected = v.conditions.find((c) => c.id === selectedId) ?? null;
  const users = selected ? v.components.filter((c) => c.defects.some((d) => d.condition === selected.id)) : [];
  return (
    <div className="grid gap-3 lg:grid-cols-[18rem_1fr]">
      <section className={`${panelClass({ tone: 'quiet' })} space-y-2 p-2`} aria-label="Conditions">
        <ul className="max-h-[32rem] overflow-y-auto">
          {v.conditions.map((c) => (
            <li key={c.id}>
              <button
                type="button"
                onClick={() => setSelectedId(c.id)}
                aria-current={c.id === selectedId}
                className={`flex w-full justify-between rounded px-2 py-1 text-left ${c.id === selectedId ? 'bg-ink font-bold text-ground' : 'hover:bg-ground'}`}
              >
                <span>{c.name}</span>
                <span className="text-sm tabular-nums opacity-70">{c.phrases.length} ph</span>
              </button>
            </li>
          ))}
        </ul>
        <form
          className="flex gap-2 border-t border-edge/20 pt-2"
          onSubmit={(e) => {
            e.preventDefault();
            const name = newName.trim().toLowerCase();
            const id = toId(name);
            if (!id || v.conditions.some((c) => c.id === id)) return;
            edit((g) => g.vocabulary.conditions.push({ id, name, phrases: [name] }));
            setSelectedId(id);
            setNewName('');
          }}
        >
          <input
            className={fieldClass}
            placeholder="new condition"
            value={newName}
            onChange={(e) => setNewName(e.target.value)}
            aria-label="New condition name"
          />
          <button type="submit" className={buttonClass('plain', 'compact')} disabled={!newName.trim()}>
            Add
          </button>
        </form>
      </section>
      <section className={`${panelClass({ tone: 'quiet' })} space-y-4`} aria-label="Condition">
        {!selected ? (
          <p className="text-muted">Pick a condition.</p>
        ) : (
          <>
            <label className="block max-w-md">
              <span className="block text-sm font-bold">Condition name</span>
              <input
                className={fieldClass}
                value={selected.name}
                onChange={(e) =>
                  edit((g) => void (g.vocabulary.conditions.find((c) => c.id === selected.id)!.name = e.target.value))
                }
              />
            </label>
            <div>
              <h3 className="mb-1 font-bold">Spoken phrases and synonyms</h3>
              <p className="mb-2 text-sm text-muted">Shared by every component with this condition ({users.length}).</p>
              <PhraseList
                label={selected.name}
                phrases={selected.phrases}
                onChange={(next) =>
                  edit((g) => void (g.vocabulary.conditions.find((c) => c.id === selected.id)!.phrases = next))
                }
              />
            </div>
            <div>
              <h3 className="mb-1 font-bold">Components with this condition</h3>
              <p className="text-base">{users.map((c) => c.name).join(' · ') || 'none yet: add it to a component'}</p>
            </div>
          </>
        )}
      </section>
    </div>
  );
}
