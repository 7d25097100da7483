// Severity never by colour alone: pass = check glyph, minor = outlined triangle,
// major = solid bar and the words OUT OF SERVICE.

export function PassMark({ label = 'Pass' }: { label?: string }) {
  return (
    <span className="inline-flex items-center gap-1 font-bold text-pass">
      <svg aria-hidden viewBox="0 0 16 16" className="h-4 w-4" fill="none" stroke="currentColor" strokeWidth="2.5">
        <path d="M2.5 8.5l3.5 3.5 7.5-8" />
      </svg>
      {label}
    </span>
  );
}

export function MinorMark({ label = 'Minor' }: { label?: string }) {
  return (
    <span className="inline-flex items-center gap-1 font-bold text-minor">
      <svg aria-hidden viewBox="0 0 16 16" className="h-4 w-4" fill="none" stroke="currentColor" strokeWidth="2">
        <path d="M8 1.8L15 14H1z" strokeLinejoin="round" />
        <path d="M8 6v4M8 11.6v.4" />
      </svg>
      {label}
    </span>
  );
}

export function MajorMark({ compact = false }: { compact?: boolean }) {
  return (
    <span className="inline-flex items-center gap-1.5 font-extrabold text-major">
      <span aria-hidden className="inline-block h-4 w-1.5 rounded-sm bg-major" />
      {compact ? 'MAJOR' : 'MAJOR · OUT OF SERVICE'}
    </span>
  );
}

export function SeverityMark({
  severity,
  compact,
}: {
  severity: 'minor' | 'major' | null | undefined;
  compact?: boolean;
}) {
  if (severity === 'major') return <MajorMark compact={compact} />;
  if (severity === 'minor') return <MinorMark />;
  return <PassMark />;
}

export function UnitStatusBadge({ status }: { status: 'in_service' | 'out_of_service' }) {
  return status === 'out_of_service' ? (
    <span
      data-testid="unit-status"
      className="inline-flex items-center gap-1.5 rounded bg-major px-2 py-0.5 text-sm font-extrabold tracking-wide whitespace-nowrap text-on-major"
    >
      <span aria-hidden className="inline-block h-3.5 w-1.5 bg-on-major" />
      OUT OF SERVICE
    </span>
  ) : (
    <span
      data-testid="unit-status"
      className="inline-flex items-center gap-1 rounded border-2 border-pass px-2 py-0.5 text-sm font-bold whitespace-nowrap text-pass"
    >
      <svg aria-hidden viewBox="0 0 16 16" className="h-3.5 w-3.5" fill="none" stroke="currentColor" strokeWidth="2.5">
        <path d="M2.5 8.5l3.5 3.5 7.5-8" />
      </svg>
      In service
    </span>
  );
}
