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

/** The zone's short name at that moment ("CST", "CDT", "GMT-6"). */
function zoneName(date: Date, timeZone: string | undefined): string {
  const part = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' })
    .formatToParts(date)
    .find((p) => p.type === 'timeZoneName');
  return part?.value ?? timeZone ?? '';
}

/** Whether two zones show a different clock time at that moment. */
function offsetsDiffer(date: Date, a: string, b: string): boolean {
  const at = (timeZone: string) =>
    new Intl.DateTimeFormat('en-US', {
      timeZone,
      hour: '2-digit',
      minute: '2-digit',
      day: 'numeric',
      hourCycle: 'h23',
    }).format(date);
  return at(a) !== at(b);
}

/**
 * One moment on screen, as a <time dateTime="ISO">. In `timeZone` (the fleet's) when given, with
 * the zone named ("05:46 CST") and, once in the browser, the viewer's own clock beside it when it
 * reads differently ("· 06:46 EST your time"). Without `timeZone` it is the viewer's zone; the
 * server cannot know that zone, so until the page runs in the browser that case shows UTC and
 * says so. `relative` shows "… ago" for past times only (a time in the future is shown as it is),
 * once in the browser; the exact time is in the tooltip.
 */
export function TimeStamp({
  iso,
  timeZone,
  format = 'datetime',
  relative = false,
  viewerClock = true,
  className,
}: {
  iso: string | null | undefined;
  timeZone?: string;
  format?: TimeStampFormat;
  relative?: boolean;
  /** Off in dense lists (a transcript's time column) where the heading already shows the viewer's clock. */
  viewerClock?: boolean;
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
  const viewerZone = inBrowser ? Intl.DateTimeFormat().resolvedOptions().timeZone : undefined;
  const viewerDiffers =
    viewerClock && !!timeZone && !!viewerZone && format !== 'date' && offsetsDiffer(date, timeZone, viewerZone);
  const named = timeZone && format !== 'date' && !past ? ` ${zoneName(date, timeZone)}` : '';
  return (
    <time dateTime={date.toISOString()} title={full} className={className} data-zone={timeZone ?? 'viewer'}>
      {past ?? `${shown}${named}`}
      {zone === 'UTC' && !timeZone ? ' UTC' : null}
      {viewerDiffers && !past ? (
        <span className="text-muted">
          {' · '}
          {new Intl.DateTimeFormat('en-US', {
            ...formats[format === 'datetime' ? 'time' : format],
            second: undefined,
            timeZone: viewerZone,
          }).format(date)}{' '}
          {zoneName(date, viewerZone)} your time
        </span>
      ) : null}
    </time>
  );
}
