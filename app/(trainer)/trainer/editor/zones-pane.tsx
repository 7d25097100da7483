'use client';

import { createColumnHelper } from '@tanstack/react-table';
import { useState } from 'react';
import { fieldClass } from '@/components/trainer/controls';
import type { Grammar, VehicleConfiguration } from '@/lib/schemas/grammar';
import type { EditFn } from './editor-client';
import { buttonClass } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';
import { Table } from '@/components/ui/table';

type ZoneItemRow = { item: Grammar['zones']['zones'][number]['items'][number]; i: number };
const itemCol = createColumnHelper<ZoneItemRow>();

function move<T>(xs: T[], from: number, to: number) {
  if (to < 0 || to >= xs.length) return;
  const [x] = xs.splice(from, 1);
  xs.splice(to, 0, x!);
}

/** Zone checklists per vehicle configuration: the walk order and each zone's items. */
export function ZonesPane({ grammar, edit }: { grammar: Grammar; edit: EditFn }) {
  const [config, setConfig] = useState<VehicleConfiguration>('tractor_trailer');
  const zones = grammar.zones.zones;
  const inConfig = zones.map((z, i) => ({ z, i })).filter(({ z }) => z.configurations.includes(config));
  const [zoneId, setZoneId] = useState(inConfig[0]?.z.id ?? zones[0]!.id);
  const zoneIndex = zones.findIndex((z) => z.id === zoneId);
  const zone = zones[zoneIndex];
  const items = zone
    ? zone.items.map((item, i) => ({ item, i })).filter(({ item }) => item.configurations.includes(config))
    : [];
  const components = [...grammar.vocabulary.components].sort((a, b) => a.name.localeCompare(b.name));
  const [newLabel, setNewLabel] = useState('');
  return (
    <div className="space-y-3">
      <label className="flex items-center gap-2">
        <span className="font-bold">Vehicle configuration</span>
        <select
          className={`${fieldClass} max-w-xs`}
          value={config}
          onChange={(e) => setConfig(e.target.value as VehicleConfiguration)}
        >
          {grammar.zones.configurations.map((c) => (
            <option key={c.id} value={c.id}>
              {c.name}
            </option>
          ))}
        </select>
      </label>
      <div className="grid gap-3 lg:grid-cols-[20rem_1fr]">
        <section className={`${panelClass({ tone: 'quiet' })} p-2`} aria-label="Walk order">
          <h2 className="px-2 pb-1 text-sm font-bold tracking-wide text-muted uppercase">Walk order</h2>
          <ol>
            {inConfig.map(({ z, i }, n) => (
              <li
                key={z.id}
                className={`flex items-center gap-1 rounded px-1 ${z.id === zoneId ? 'bg-ink text-ground' : ''}`}
              >
                <span className="w-6 text-right tabular-nums opacity-70">{n + 1}.</span>
                <button type="button" className="grow px-1 py-1 text-left font-bold" onClick={() => setZoneId(z.id)}>
                  {z.name}{' '}
                  <span className="text-sm font-normal opacity-70">
                    ({z.items.filter((x) => x.configurations.includes(config)).length})
                  </span>
                </button>
                <button
                  type="button"
                  aria-label={`Move ${z.name} earlier`}
                  className="inline-flex min-h-8 min-w-8 items-center justify-center rounded hover:bg-ground hover:text-ink"
                  onClick={() => edit((g) => move(g.zones.zones, i, inConfig[n - 1]?.i ?? -1))}
                >
                  ↑
                </button>
                <button
                  type="button"
                  aria-label={`Move ${z.name} later`}
                  className="inline-flex min-h-8 min-w-8 items-center justify-center rounded hover:bg-ground hover:text-ink"
                  onClick={() => edit((g) => move(g.zones.zones, i, inConfig[n + 1]?.i ?? -1))}
                >
                  ↓
                </button>
              </li>
            ))}
          </ol>
        </section>
        <section className={`${panelClass({ tone: 'quiet' })} space-y-3`} aria-label="Checklist">
          {zone && (
            <>
              <h2 className="text-xl font-extrabold">
                {zone.name}: checklist for {grammar.zones.configurations.find((c) => c.id === config)?.name}
              </h2>
              <Table
                label={`Checklist of ${zone.name}`}
                data={items}
                getRowId={({ item }) => item.id}
                enableSorting={false}
                framed={false}
                density="dense"
                columns={[
                  itemCol.display({
                    id: 'order',
                    header: 'Order',
                    cell: ({
                      row: {
                        original: { item, i },
                        index: n,
                      },
                    }) => (
                      <>
                        <button
                          type="button"
                          aria-label={`Move ${item.label} up`}
                          className="inline-flex min-h-8 min-w-8 items-center justify-center rounded hover:bg-ground"
                          onClick={() => edit((g) => move(g.zones.zones[zoneIndex]!.items, i, items[n - 1]?.i ?? -1))}
                        >
                          ↑
                        </button>
                        <button
                          type="button"
                          aria-label={`Move ${item.label} down`}
                          className="inline-flex min-h-8 min-w-8 items-center justify-center rounded hover:bg-ground"
                          onClick={() => edit((g) => move(g.zones.zones[zoneIndex]!.items, i, items[n + 1]?.i ?? -1))}
                        >
                          ↓
                        </button>
                      </>
                    ),
                  }),
                  itemCol.display({
                    id: 'label',
                    header: 'Item as read to the driver',
                    meta: { className: 'sm:w-1/2' },
                    cell: ({
                      row: {
                        original: { item, i },
                      },
                    }) => (
                      <>
                        <input
                          aria-label={`Label of ${item.id}`}
                          className={fieldClass}
                          value={item.label}
                          onChange={(e) =>
                            edit((g) => void (g.zones.zones[zoneIndex]!.items[i]!.label = e.target.value))
                          }
                        />
                      </>
                    ),
                  }),
                  itemCol.display({
                    id: 'component',
                    header: 'Component',
                    cell: ({
                      row: {
                        original: { item, i },
                      },
                    }) => (
                      <>
                        <select
                          aria-label={`Component of ${item.label}`}
                          className={fieldClass}
                          value={item.component}
                          onChange={(e) =>
                            edit((g) => void (g.zones.zones[zoneIndex]!.items[i]!.component = e.target.value))
                          }
                        >
                          {components.map((c) => (
                            <option key={c.id} value={c.id}>
                              {c.name}
                            </option>
                          ))}
                        </select>
                        {item.measure && (
                          <span className="text-sm text-muted">reading: {item.measure.replace(/_/g, ' ')}</span>
                        )}
                      </>
                    ),
                  }),
                  itemCol.display({
                    id: 'configurations',
                    header: 'Configurations',
                    meta: { className: 'text-sm' },
                    cell: ({
                      row: {
                        original: { item, i },
                      },
                    }) => (
                      <>
                        {grammar.zones.configurations.map((c) => (
                          <label key={c.id} className="mr-2 inline-flex items-center gap-1">
                            <input
                              type="checkbox"
                              checked={item.configurations.includes(c.id)}
                              disabled={item.configurations.length === 1 && item.configurations.includes(c.id)}
                              onChange={(e) =>
                                edit((g) => {
                                  const it = g.zones.zones[zoneIndex]!.items[i]!;
                                  it.configurations = e.target.checked
                                    ? [...it.configurations, c.id]
                                    : it.configurations.filter((x) => x !== c.id);
                                })
                              }
                            />
                            {c.id === 'bobtail' ? 'bobtail' : 'with trailer'}
                          </label>
                        ))}
                      </>
                    ),
                  }),
                  itemCol.display({
                    id: 'remove',
                    header: () => <span className="sr-only">Remove</span>,
                    meta: { cardLabel: '' },
                    cell: ({
                      row: {
                        original: { item, i },
                      },
                    }) => (
                      <>
                        <button
                          type="button"
                          className={buttonClass('plain', 'compact')}
                          disabled={zone.items.length <= 1}
                          aria-label={`Remove ${item.label}`}
                          onClick={() => edit((g) => void g.zones.zones[zoneIndex]!.items.splice(i, 1))}
                        >
                          ×
                        </button>
                      </>
                    ),
                  }),
                ]}
              />
              <form
                className="flex gap-2"
                onSubmit={(e) => {
                  e.preventDefault();
                  const label = newLabel.trim();
                  const slug = label
                    .toLowerCase()
                    .replace(/[^a-z0-9]+/g, '_')
                    .replace(/^_|_$/g, '');
                  if (!slug) return;
                  const id = `${zone.id}.${slug}`;
                  if (zone.items.some((x) => x.id === id)) return;
                  const component =
                    grammar.vocabulary.components.find((c) => c.zones.includes(zone.id))?.id ?? components[0]!.id;
                  edit(
                    (g) =>
                      void g.zones.zones[zoneIndex]!.items.push({ id, label, component, configurations: [config] }),
                  );
                  setNewLabel('');
                }}
              >
                <input
                  className={fieldClass}
                  placeholder="new checklist item"
                  value={newLabel}
                  onChange={(e) => setNewLabel(e.target.value)}
                  aria-label="New checklist item"
                />
                <button type="submit" className={buttonClass('plain', 'compact')} disabled={!newLabel.trim()}>
                  Add item
                </button>
              </form>
            </>
          )}
        </section>
      </div>
    </div>
  );
}
