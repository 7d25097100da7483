'use client';

import { useHydrated } from './use-hydrated';

export type TimeStampFormat = 'datetime' | 'date' | 'time';

const formats: Record<TimeStampFormat, Intl.DateTimeFormatOptions> = {
  datetime: { month: 'short', day: 'numeric', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' },
  date: { month: 'short', day: 'numeric', year: 'numeric' },
  time: { hour: '2-digit', minute: '2-digit', second: '2-digit', hourCycle: 'h23' },
};

const units: [Intl.RelativeTimeFormatUnit, number][] = [
  ['day', 86_400_000],
  ['hour', 3_600_000],
  ['minute', 60_000],
];

/** "5 min ago", "3 days ago"; null for a time in the future or under a minute old. */
export function formatPast(date: Date, now: Date): string | null {
  const ms = now.getTime() - date.getTime();
  if (ms < 60_000) return ms >= 0 ? 'just now' : null;
  const rtf = new Intl.RelativeTimeFormat('en-US', { numeric: 'always', style: 'long' });
  for (const [unit, size] of units) {
    if (ms >= size || unit === 'minute') return rtf.format(-Math.floor(ms / size), unit);
  }
  return null;
}

/**
 * One moment on screen, as a <time dateTime="ISO">. In `timeZone` (the fleet's) when given,
 * otherwise in the viewer's; the server cannot know the viewer's zone, so until the page runs in
 * the browser that case shows UTC and says so. `relative` shows "… ago" for past times only (a
 * time in the future is shown as it is), once in the browser; the exact time is in the tooltip.
 */
export function TimeStamp({
  iso,
  timeZone,
  format = 'datetime',
  relative = false,
  className,
}: {
  iso: string | null | undefined;
  timeZone?: string;
  format?: TimeStampFormat;
  relative?: boolean;
  className?: string;
}) {
  const inBrowser = useHydrated();
  if (!iso) return <span className={className}>—</span>;
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return <span className={className}>—</span>;
  const zone = timeZone ?? (inBrowser ? undefined : 'UTC');
  const shown = new Intl.DateTimeFormat('en-US', { ...formats[format], timeZone: zone }).format(date);
  const full = new Intl.DateTimeFormat('en-US', {
    dateStyle: 'full',
    timeStyle: 'long',
    timeZone: zone,
  }).format(date);
  const past = relative && inBrowser ? formatPast(date, new Date()) : null;
  return (
    <time dateTime={date.toISOString()} title={full} className={className}>
      {past ?? shown}
      {zone === 'UTC' && !timeZone ? ' UTC' : null}
    </time>
  );
}
