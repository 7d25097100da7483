import { cx } from './cx';

/** A unit's state in words and a shape, never by colour alone: in service, OUT OF SERVICE, retired. */
export function UnitStatus({
  status,
  retired = false,
  className,
}: {
  status: 'in_service' | 'out_of_service';
  retired?: boolean;
  className?: string;
}) {
  const base = 'inline-flex max-w-full items-center gap-1.5 rounded px-2 py-0.5 text-sm';
  if (retired)
    return (
      <span
        data-testid="unit-status"
        className={cx(base, 'border-2 border-dashed border-muted font-bold text-muted', className)}
      >
        Retired
      </span>
    );
  if (status === 'out_of_service')
    return (
      <span
        data-testid="unit-status"
        className={cx(base, 'bg-major font-extrabold tracking-wide text-on-major', className)}
      >
        <span aria-hidden="true" className="inline-block h-3.5 w-1.5 shrink-0 bg-on-major" />
        OUT OF SERVICE
      </span>
    );
  return (
    <span data-testid="unit-status" className={cx(base, 'border-2 border-pass font-bold text-pass', className)}>
      <svg
        aria-hidden="true"
        viewBox="0 0 16 16"
        className="h-3.5 w-3.5 shrink-0"
        fill="none"
        stroke="currentColor"
        strokeWidth="2.5"
      >
        <path d="M2.5 8.5l3.5 3.5 7.5-8" />
      </svg>
      In service
    </span>
  );
}
