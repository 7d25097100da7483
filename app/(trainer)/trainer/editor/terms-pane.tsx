'use client';

import { createColumnHelper } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { fieldClass } from '@/components/trainer/controls';
import { PhraseList } from '@/components/trainer/phrase-list';
import { zoneIdSchema, type Grammar, type ZoneId } from '@/lib/schemas/grammar';
import type { EditFn } from './editor-client';
import { buttonClass } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';
import { Table } from '@/components/ui/table';

type ComponentDefect = Grammar['vocabulary']['components'][number]['defects'][number];
const defectCol = createColumnHelper<ComponentDefect>();

const toId = (s: string) =>
  s
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '_')
    .replace(/^_|_$/g, '');
const zoneIds = zoneIdSchema.options;

export function TermsPane({
  grammar,
  edit,
  onOpenCondition,
}: {
  grammar: Grammar;
  edit: EditFn;
  onOpenCondition: (id: string) => void;
}) {
  const v = grammar.vocabulary;
  const [systemId, setSystemId] = useState(v.systems[0]?.id ?? '');
  const [componentId, setComponentId] = useState<string | null>(null);
  const [filter, setFilter] = useState('');
  const [newComponent, setNewComponent] = useState('');
  const zoneName = useMemo(() => new Map(grammar.zones.zones.map((z) => [z.id, z.name])), [grammar.zones]);
  const conditionName = useMemo(() => new Map(v.conditions.map((c) => [c.id, c.name])), [v.conditions]);
  const f = filter.trim().toLowerCase();
  const components = v.components.filter((c) =>
    f ? c.name.includes(f) || c.phrases.some((p) => p.includes(f)) : c.system === systemId,
  );
  const selected = v.components.find((c) => c.id === componentId) ?? null;
  const editComponent = (change: (c: Grammar['vocabulary']['components'][number]) => void) =>
    edit((g) => {
      const c = g.vocabulary.components.find((x) => x.id === componentId);
      if (c) change(c);
    });
  const unused = selected ? v.conditions.filter((c) => !selected.defects.some((d) => d.condition === c.id)) : [];
  return (
    <div className="grid gap-3 lg:grid-cols-[14rem_18rem_1fr]">
      <section className={`${panelClass({ tone: 'quiet' })} p-2`} aria-label="Systems">
        <h2 className="px-2 pb-1 text-sm font-bold tracking-wide text-muted uppercase">Systems</h2>
        <ul>
          {v.systems.map((s) => {
            const n = v.components.filter((c) => c.system === s.id).length;
            return (
              <li key={s.id}>
                <button
                  type="button"
                  onClick={() => {
                    setSystemId(s.id);
                    setFilter('');
                  }}
                  aria-current={s.id === systemId && !f}
                  className={`flex w-full justify-between rounded px-2 py-1 text-left ${s.id === systemId && !f ? 'bg-vest font-bold text-on-vest' : 'hover:bg-ground'}`}
                >
                  <span>{s.name}</span>
                  <span className="tabular-nums">{n}</span>
                </button>
              </li>
            );
          })}
        </ul>
      </section>
      <section className={`${panelClass({ tone: 'quiet' })} space-y-2 p-2`} aria-label="Components">
        <input
          className={fieldClass}
          placeholder="find a component or phrase"
          value={filter}
          onChange={(e) => setFilter(e.target.value)}
          aria-label="Find a component"
        />
        <ul className="max-h-[32rem] overflow-y-auto">
          {components.map((c) => (
            <li key={c.id}>
              <button
                type="button"
                onClick={() => setComponentId(c.id)}
                aria-current={c.id === componentId}
                className={`flex w-full justify-between gap-2 rounded px-2 py-1 text-left ${c.id === componentId ? 'bg-ink font-bold text-ground' : 'hover:bg-ground'}`}
              >
                <span>{c.name}</span>
                <span className="text-sm tabular-nums opacity-70">
                  {c.phrases.length} ph · {c.defects.length} def
                </span>
              </button>
            </li>
          ))}
          {components.length === 0 && <li className="px-2 text-muted">No component.</li>}
        </ul>
        {!f && (
          <form
            className="flex gap-2 border-t border-edge/20 pt-2"
            onSubmit={(e) => {
              e.preventDefault();
              const name = newComponent.trim().toLowerCase();
              const id = toId(name);
              if (!id || v.components.some((c) => c.id === id)) return;
              const condition = v.conditions[0]!.id;
              edit((g) =>
                g.vocabulary.components.push({
                  id,
                  system: systemId,
                  name,
                  phrases: [name],
                  zones: ['front'],
                  defects: [{ condition, severity: { us: 'minor', ca: 'minor' }, source: 'fleet rule' }],
                }),
              );
              setComponentId(id);
              setNewComponent('');
            }}
          >
            <input
              className={fieldClass}
              placeholder="new component"
              value={newComponent}
              onChange={(e) => setNewComponent(e.target.value)}
              aria-label="New component name"
            />
            <button type="submit" className={buttonClass('plain', 'compact')} disabled={!newComponent.trim()}>
              Add
            </button>
          </form>
        )}
      </section>
      <section className={`${panelClass({ tone: 'quiet' })} space-y-4`} aria-label="Component">
        {!selected ? (
          <p className="text-muted">Pick a component to edit its phrases, zones and defects.</p>
        ) : (
          <>
            <div className="flex flex-wrap items-end gap-3">
              <label className="grow">
                <span className="block text-sm font-bold">Component name</span>
                <input
                  className={fieldClass}
                  value={selected.name}
                  onChange={(e) => editComponent((c) => void (c.name = e.target.value))}
                />
              </label>
              <label>
                <span className="block text-sm font-bold">System</span>
                <select
                  className={fieldClass}
                  value={selected.system}
                  onChange={(e) => editComponent((c) => void (c.system = e.target.value))}
                >
                  {v.systems.map((s) => (
                    <option key={s.id} value={s.id}>
                      {s.name}
                    </option>
                  ))}
                </select>
              </label>
              <code className="pb-2 text-sm text-muted">{selected.id}</code>
            </div>
            <div>
              <h3 className="mb-1 font-bold">Spoken phrases and synonyms</h3>
              <PhraseList
                label={selected.name}
                phrases={selected.phrases}
                onChange={(next) => editComponent((c) => void (c.phrases = next))}
              />
            </div>
            <fieldset>
              <legend className="mb-1 font-bold">Zones where it applies</legend>
              <div className="flex flex-wrap gap-x-4 gap-y-1">
                {zoneIds.map((z) => (
                  <label key={z} className="inline-flex items-center gap-1.5">
                    <input
                      type="checkbox"
                      className="h-4 w-4 accent-current"
                      checked={selected.zones.includes(z)}
                      disabled={selected.zones.length === 1 && selected.zones.includes(z)}
                      onChange={(e) =>
                        editComponent(
                          (c) =>
                            void (c.zones = e.target.checked
                              ? [...c.zones, z]
                              : c.zones.filter((x: ZoneId) => x !== z)),
                        )
                      }
                    />
                    {zoneName.get(z) ?? z}
                  </label>
                ))}
              </div>
            </fieldset>
            <div>
              <h3 className="mb-1 font-bold">Conditions (defects) with severity and source</h3>
              <Table
                label="Conditions (defects) with severity and source"
                data={selected.defects}
                getRowId={(d) => d.condition}
                enableSorting={false}
                framed={false}
                density="dense"
                columns={[
                  defectCol.accessor('condition', {
                    header: 'Condition',
                    meta: { card: 'title' },
                    cell: ({ row: { original: d } }) => (
                      <button
                        type="button"
                        className="text-left font-bold underline-offset-2 hover:underline"
                        onClick={() => onOpenCondition(d.condition)}
                      >
                        {conditionName.get(d.condition) ?? d.condition}
                      </button>
                    ),
                  }),
                  ...(['us', 'ca'] as const).map((p) =>
                    defectCol.display({
                      id: p,
                      header: p === 'us' ? 'US' : 'Canada',
                      cell: ({ row: { original: d, index: i } }) => (
                        <select
                          aria-label={`${p === 'us' ? 'US' : 'Canada'} severity of ${conditionName.get(d.condition)}`}
                          className={fieldClass.replace('w-full', 'w-28')}
                          value={d.severity[p]}
                          onChange={(e) =>
                            editComponent((c) => void (c.defects[i]!.severity[p] = e.target.value as 'minor' | 'major'))
                          }
                        >
                          <option value="minor">△ minor</option>
                          <option value="major">■ major</option>
                        </select>
                      ),
                    }),
                  ),
                  defectCol.accessor('source', {
                    header: 'Source note',
                    meta: { className: 'sm:w-full' },
                    cell: ({ row: { original: d, index: i } }) => (
                      <input
                        title={d.source}
                        aria-label={`Source of ${conditionName.get(d.condition)}`}
                        className={fieldClass}
                        value={d.source}
                        onChange={(e) => editComponent((c) => void (c.defects[i]!.source = e.target.value))}
                      />
                    ),
                  }),
                  defectCol.display({
                    id: 'remove',
                    header: () => <span className="sr-only">Remove</span>,
                    meta: { cardLabel: '' },
                    cell: ({ row: { original: d, index: i } }) => (
                      <button
                        type="button"
                        className={buttonClass('plain', 'compact')}
                        disabled={selected.defects.length <= 1}
                        aria-label={`Remove ${conditionName.get(d.condition)}`}
                        onClick={() => editComponent((c) => void c.defects.splice(i, 1))}
                      >
                        ×
                      </button>
                    ),
                  }),
                ]}
              />
              {unused.length > 0 && (
                <label className="mt-2 flex items-center gap-2">
                  <span className="text-sm font-bold">Add a condition</span>
                  <select
                    className={`${fieldClass} max-w-xs`}
                    value=""
                    onChange={(e) => {
                      const condition = e.target.value;
                      if (condition)
                        editComponent(
                          (c) =>
                            void c.defects.push({
                              condition,
                              severity: { us: 'minor', ca: 'minor' },
                              source: 'fleet rule',
                            }),
                        );
                    }}
                  >
                    <option value="">choose…</option>
                    {unused.map((c) => (
                      <option key={c.id} value={c.id}>
                        {c.name}
                      </option>
                    ))}
                  </select>
                </label>
              )}
            </div>
          </>
        )}
      </section>
    </div>
  );
}
