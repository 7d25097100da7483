import type { UnitDto } from '@/lib/schemas/units';

/** A unit's state in words and a glyph, never by colour alone. */
export function UnitStatusBadge({ unit }: { unit: Pick<UnitDto, 'status' | 'retiredAt'> }) {
  if (unit.retiredAt) {
    return (
      <span className="inline-flex items-center gap-1 rounded border-2 border-dashed border-muted px-2 text-base font-bold text-muted">
        Retired
      </span>
    );
  }
  if (unit.status === 'out_of_service') {
    return (
      <span className="inline-flex items-center gap-1 rounded bg-major px-2 text-base font-extrabold tracking-wide text-on-major">
        <span aria-hidden="true">▬</span> OUT OF SERVICE
      </span>
    );
  }
  return (
    <span className="inline-flex items-center gap-1 rounded border-2 border-pass px-2 text-base font-bold text-pass">
      <span aria-hidden="true">✓</span> In service
    </span>
  );
}
