'use client';

import { useState } from 'react';
import { buttonClass } from '@/components/ui/button';
import { chipClass, fieldClass } from './controls';

/** Spoken phrases as removable chips, with a box to add one. */
export function PhraseList({
  phrases,
  onChange,
  label,
}: {
  phrases: string[];
  onChange: (next: string[]) => void;
  label: string;
}) {
  const [draft, setDraft] = useState('');
  const add = () => {
    const p = draft.trim().toLowerCase().replace(/\s+/g, ' ');
    if (!p || phrases.includes(p)) return setDraft('');
    onChange([...phrases, p]);
    setDraft('');
  };
  return (
    <div className="space-y-2">
      <ul className="flex flex-wrap gap-1.5" aria-label={label}>
        {phrases.map((p) => (
          <li key={p} className={chipClass}>
            <span>{p}</span>
            <button
              type="button"
              className="rounded px-1 font-bold text-muted hover:text-major disabled:opacity-40"
              aria-label={`Remove phrase ${p}`}
              disabled={phrases.length <= 1}
              onClick={() => onChange(phrases.filter((x) => x !== p))}
            >
              ×
            </button>
          </li>
        ))}
      </ul>
      <form
        className="flex gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          add();
        }}
      >
        <input
          className={fieldClass}
          value={draft}
          maxLength={80}
          onChange={(e) => setDraft(e.target.value)}
          placeholder="add a phrase or synonym"
          aria-label={`New phrase for ${label}`}
        />
        <button type="submit" className={buttonClass('plain', 'compact')} disabled={!draft.trim()}>
          Add
        </button>
      </form>
    </div>
  );
}
