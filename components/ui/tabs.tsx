'use client';

import Link from 'next/link';
import { usePathname, useSearchParams } from 'next/navigation';
import { useRef, type KeyboardEvent } from 'react';
import { cx } from './cx';

const tabClass = (current: boolean) =>
  cx(
    'inline-flex min-h-11 items-center rounded-md border-slab px-3 text-base font-bold',
    current ? 'border-edge bg-ink text-ground' : 'border-transparent hover:border-edge/40 hover:bg-panel',
  );

export type NavTab = {
  href: string;
  label: string;
  /** `exact`: current only on this path; `prefix` (default): also on the paths under it. */
  match?: 'exact' | 'prefix';
};

/**
 * How well a tab's href matches the address: its path must be the address's path (or, with
 * `prefix`, a folder of it) and each query parameter it names must be the address's; the more
 * specific match scores higher. -1 when it does not match.
 */
function scoreTab(tab: NavTab, path: string, search: URLSearchParams): number {
  const url = new URL(tab.href, 'http://local');
  const pathOk =
    path === url.pathname || (tab.match !== 'exact' && path.startsWith(`${url.pathname.replace(/\/$/, '')}/`));
  if (!pathOk) return -1;
  const params = [...url.searchParams];
  if (params.some(([k, v]) => search.get(k) !== v)) return -1;
  return url.pathname.length * 10 + params.length;
}

/** The tab the address is on: the most specific match ("/trainer/editor" over "/trainer"). */
export function findCurrentTab<T extends NavTab>(items: T[], path: string, search: URLSearchParams): T | undefined {
  let best: T | undefined;
  let bestScore = -1;
  for (const t of items) {
    const score = scoreTab(t, path, search);
    if (score > bestScore) [bestScore, best] = [score, t];
  }
  return best;
}

/**
 * A strip of links between screens. The current one is drawn filled and carries
 * aria-current="page". By default it is found from the address (path, then query); `current`
 * (an href) overrides that.
 */
export function NavTabs({
  items,
  label,
  current,
  className,
}: {
  items: NavTab[];
  label: string;
  current?: string;
  className?: string;
}) {
  const path = usePathname();
  const search = useSearchParams();
  const active = current ?? findCurrentTab(items, path, new URLSearchParams(search.toString()))?.href;
  return (
    <nav aria-label={label} className={cx('flex flex-wrap gap-1.5', className)}>
      {items.map((t) => (
        <Link
          key={t.href}
          href={t.href}
          aria-current={t.href === active ? 'page' : undefined}
          className={tabClass(t.href === active)}
        >
          {t.label}
        </Link>
      ))}
    </nav>
  );
}

/**
 * Tabs that switch a panel on the same screen (WAI-ARIA tabs: arrow keys move between them).
 * The panel itself is the caller's: give it `id={panelId(idPrefix, value)}`, role="tabpanel".
 */
export function Tabs<T extends string>({
  items,
  value,
  onChange,
  label,
  idPrefix,
  className,
}: {
  items: { id: T; label: string }[];
  value: T;
  onChange: (id: T) => void;
  label: string;
  idPrefix: string;
  className?: string;
}) {
  const refs = useRef<(HTMLButtonElement | null)[]>([]);
  const onKeyDown = (e: KeyboardEvent, i: number) => {
    const step = e.key === 'ArrowRight' ? 1 : e.key === 'ArrowLeft' ? -1 : 0;
    const to =
      e.key === 'Home' ? 0 : e.key === 'End' ? items.length - 1 : step ? (i + step + items.length) % items.length : -1;
    const item = items[to];
    if (to < 0 || !item) return;
    e.preventDefault();
    onChange(item.id);
    refs.current[to]?.focus();
  };
  return (
    <div role="tablist" aria-label={label} className={cx('flex flex-wrap gap-1.5', className)}>
      {items.map((t, i) => (
        <button
          key={t.id}
          ref={(el) => {
            refs.current[i] = el;
          }}
          type="button"
          role="tab"
          id={tabId(idPrefix, t.id)}
          aria-selected={t.id === value}
          aria-controls={panelId(idPrefix, t.id)}
          tabIndex={t.id === value ? 0 : -1}
          onClick={() => onChange(t.id)}
          onKeyDown={(e) => onKeyDown(e, i)}
          className={tabClass(t.id === value)}
        >
          {t.label}
        </button>
      ))}
    </div>
  );
}

export const tabId = (prefix: string, id: string) => `${prefix}-tab-${id}`;
export const panelId = (prefix: string, id: string) => `${prefix}-panel-${id}`;
