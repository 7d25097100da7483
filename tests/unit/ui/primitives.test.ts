// The shared UI parts render what they promise: rendered to HTML on the server (no DOM needed).
import { createColumnHelper } from '@tanstack/react-table';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { Field } from '@/components/ui/field';
import { SeverityMark } from '@/components/ui/severity-mark';
import { Table } from '@/components/ui/table';
import { findCurrentTab } from '@/components/ui/tabs';
import { formatPast, TimeStamp } from '@/components/ui/time-stamp';
import { UnitStatus } from '@/components/ui/unit-status';

const html = (el: Parameters<typeof renderToStaticMarkup>[0]) => renderToStaticMarkup(el);
const text = (markup: string) => markup.replace(/<[^>]+>/g, '');

describe('SeverityMark: never by colour alone', () => {
  it('a major defect carries a solid bar and the words OUT OF SERVICE', () => {
    const out = html(createElement(SeverityMark, { severity: 'major', count: 2 }));
    expect(text(out)).toBe('2 MAJOR · OUT OF SERVICE');
    expect(out).toMatch(/<span aria-hidden="true" class="[^"]*bg-major/);
  });
  it('a minor defect carries an outlined triangle, a pass a check glyph, each with words', () => {
    const minor = html(createElement(SeverityMark, { severity: 'minor' }));
    expect(minor).toContain('fill="none"');
    expect(minor).toContain('M8 1.8L15 14H1z');
    expect(text(minor)).toBe('Minor');
    const pass = html(createElement(SeverityMark, { severity: 'pass', label: 'Reviewed' }));
    expect(pass).toContain('M2.5 8.5l3.5 3.5 7.5-8');
    expect(text(pass)).toBe('Reviewed');
  });
});

describe('UnitStatus', () => {
  it('says the state in words, a retired unit before anything else', () => {
    expect(text(html(createElement(UnitStatus, { status: 'out_of_service' })))).toBe('OUT OF SERVICE');
    expect(text(html(createElement(UnitStatus, { status: 'in_service' })))).toBe('In service');
    expect(text(html(createElement(UnitStatus, { status: 'out_of_service', retired: true })))).toBe('Retired');
  });
});

describe('Field', () => {
  it('ties the error and the hint to the control (WAI-ARIA 1.2: aria-describedby, aria-invalid)', () => {
    const out = html(
      createElement(Field, {
        id: 'odo',
        label: 'Odometer',
        hint: 'miles',
        error: 'Enter a number.',
        children: (c) => createElement('input', c),
      }),
    );
    expect(out).toContain('<label for="odo"');
    expect(out).toMatch(/<input id="odo" aria-describedby="odo-error odo-hint" aria-invalid="true"\/>/);
    expect(out).toContain('<p id="odo-error"');
    expect(text(out)).toContain('Enter a number.');
  });
  it('marks a control without an error as valid and describes it by its hint only', () => {
    const out = html(
      createElement(Field, { id: 'x', label: 'X', hint: 'h', children: (c) => createElement('input', c) }),
    );
    expect(out).toContain('aria-describedby="x-hint" aria-invalid="false"');
  });
});

type Row = { id: string; name: string; n: number };
const col = createColumnHelper<Row>();
const columns = [
  col.accessor('name', { header: 'Name', meta: { card: 'title' } }),
  col.accessor('n', { header: 'Count', size: 90, meta: { align: 'right' } }),
];
const rows: Row[] = [
  { id: 'a', name: 'alpha', n: 2 },
  { id: 'b', name: 'bravo', n: 10 },
  { id: 'c', name: 'charlie', n: 5 },
];

describe('Table', () => {
  it('sorts by the given column and says so on its header (WAI-ARIA 1.2: aria-sort)', () => {
    const out = html(
      createElement(Table<Row>, {
        label: 'Things',
        data: rows,
        columns,
        getRowId: (r) => r.id,
        sorting: [{ id: 'n', desc: true }],
        rowProps: (r) => ({ 'data-testid': `row-${r.id}` }),
      }),
    );
    const order = [...out.matchAll(/data-testid="row-(\w)"/g)].map((m) => m[1]);
    expect(order).toEqual(['b', 'c', 'a']);
    expect(out).toMatch(/aria-sort="descending"[^>]*>.*?Count/);
    expect(out).toMatch(/aria-sort="none"[^>]*>.*?Name/);
    expect(out).toContain('aria-label="Things"');
    expect(out).toContain('<col style="width:90px"/>');
  });
  it('gives each cell its column label for the card layout, except the card title', () => {
    const out = html(createElement(Table<Row>, { label: 'Things', data: rows.slice(0, 1), columns }));
    // One label per labelled cell, hidden from screen readers (they have the column header).
    expect(out.match(/<span aria-hidden="true"[^>]*sm:hidden[^>]*>Count<\/span>/g)).toHaveLength(1);
    expect(out).not.toMatch(/sm:hidden[^>]*>Name<\/span>/);
  });
  it('leaves a cell with nothing in it out of the card, not as a bare label', () => {
    const out = html(createElement(Table<Row>, { label: 'Things', data: [{ id: 'e', name: '', n: 1 }], columns }));
    expect(out).toMatch(/<td role="cell" class="[^"]*max-sm:hidden[^"]*"><span class="[^"]*"><\/span><\/td>/);
  });
  it('shows the empty state when there is no row', () => {
    const out = html(createElement(Table<Row>, { label: 'Things', data: [], columns, empty: 'Nothing yet.' }));
    expect(out).toMatch(/<td role="cell" colSpan="2"[^>]*>Nothing yet\.<\/td>/);
  });
});

describe('TimeStamp', () => {
  const iso = '2026-12-02T11:46:00.000Z';
  it('renders a <time> with the ISO instant and the time in the fleet zone (IANA tz: Chicago is UTC−6 in December)', () => {
    const out = html(createElement(TimeStamp, { iso, timeZone: 'America/Chicago' }));
    expect(out).toContain(`dateTime="${iso}"`);
    expect(text(out)).toBe('Dec 2, 2026, 05:46 CST');
  });
  it('says UTC on the server when it must show the viewer’s zone, which only the browser knows', () => {
    expect(text(html(createElement(TimeStamp, { iso })))).toBe('Dec 2, 2026, 11:46 UTC');
  });
  it('puts relative words on past times only', () => {
    const now = new Date('2026-12-02T12:00:00Z');
    expect(formatPast(new Date('2026-12-02T11:55:00Z'), now)).toBe('5 minutes ago');
    expect(formatPast(new Date('2026-12-02T09:00:00Z'), now)).toBe('3 hours ago');
    expect(formatPast(new Date('2026-11-29T12:00:00Z'), now)).toBe('3 days ago');
    expect(formatPast(new Date('2026-12-02T15:00:00Z'), now)).toBeNull();
  });
});

describe('findCurrentTab (WAI-ARIA 1.2: aria-current="page" goes to one tab)', () => {
  const items = [
    { href: '/mechanic', label: 'Open defects' },
    { href: '/mechanic?status=closed', label: 'Certified' },
    { href: '/supervisor', label: 'Units' },
    { href: '/supervisor/reports', label: 'Reports' },
  ];
  const at = (path: string, q = '') => findCurrentTab(items, path, new URLSearchParams(q))?.label;
  it('prefers the most specific path, and the tab whose query the address carries', () => {
    expect(at('/supervisor/reports/abc')).toBe('Reports');
    expect(at('/supervisor')).toBe('Units');
    expect(at('/mechanic', 'status=closed')).toBe('Certified');
    expect(at('/mechanic')).toBe('Open defects');
    expect(at('/mechanic/defects/1')).toBe('Open defects');
    expect(at('/supervisorship')).toBeUndefined();
  });
});
