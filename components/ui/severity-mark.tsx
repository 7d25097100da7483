import { cx } from './cx';

export type Severity = 'pass' | 'minor' | 'major';

/**
 * Severity in a shape and words, never by colour alone: pass = a check glyph, minor = an
 * outlined triangle, major = a solid bar and the words OUT OF SERVICE.
 * `label` replaces the words of a pass or minor mark; a major mark always says OUT OF SERVICE.
 */
export function SeverityMark({
  severity,
  label,
  count,
  compact = false,
  className,
}: {
  severity: Severity;
  label?: string;
  /** How many: "2 MAJOR · OUT OF SERVICE", "3 minor". */
  count?: number;
  compact?: boolean;
  className?: string;
}) {
  const size = compact ? 'text-sm' : '';
  const glyph = compact ? 'h-3.5 w-3.5' : 'h-4 w-4';
  const bar = compact ? 'h-3.5 w-1.5' : 'h-4 w-1.5';
  const n = count === undefined ? '' : `${count} `;
  if (severity === 'major')
    return (
      <span
        data-severity="major"
        className={cx('inline-flex items-center gap-1.5 font-extrabold text-major', size, className)}
      >
        <span aria-hidden="true" className={cx('inline-block shrink-0 rounded-sm bg-major', bar)} />
        <span>
          {n}
          {label ?? 'MAJOR'} · OUT OF SERVICE
        </span>
      </span>
    );
  if (severity === 'minor')
    return (
      <span
        data-severity="minor"
        className={cx('inline-flex items-center gap-1 font-bold text-minor', size, className)}
      >
        <svg
          aria-hidden="true"
          viewBox="0 0 16 16"
          className={cx('shrink-0', glyph)}
          fill="none"
          stroke="currentColor"
          strokeWidth="2"
        >
          <path d="M8 1.8L15 14H1z" strokeLinejoin="round" />
          <path d="M8 6v4M8 11.6v.4" />
        </svg>
        <span>
          {n}
          {label ?? 'Minor'}
        </span>
      </span>
    );
  return (
    <span data-severity="pass" className={cx('inline-flex items-center gap-1 font-bold text-pass', size, className)}>
      <svg
        aria-hidden="true"
        viewBox="0 0 16 16"
        className={cx('shrink-0', glyph)}
        fill="none"
        stroke="currentColor"
        strokeWidth="2.5"
      >
        <path d="M2.5 8.5l3.5 3.5 7.5-8" />
      </svg>
      <span>{label ?? 'Pass'}</span>
    </span>
  );
}
