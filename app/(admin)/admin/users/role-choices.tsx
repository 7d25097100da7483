import { roleLabel, roles, type Role } from '@/lib/schemas/users';

export const roleDuty: Record<Role, string> = {
  driver: 'walks and signs inspections',
  mechanic: 'works open defects, certifies repairs',
  supervisor: 'reviews reports and units off the road',
  trainer: 'tunes the words RigCall listens for',
  admin: 'people, units and fleet settings',
};

/** A group of role checkboxes; `locked` roles are shown checked and cannot be cleared. */
export function RoleChoices({
  idPrefix,
  value,
  onChange,
  locked = [],
  error,
}: {
  idPrefix: string;
  value: Role[];
  onChange: (next: Role[]) => void;
  locked?: Role[];
  error?: string;
}) {
  const errorId = `${idPrefix}-roles-error`;
  return (
    <fieldset className="flex flex-col gap-1" aria-describedby={error ? errorId : undefined}>
      <legend className="mb-1 text-base font-bold">Roles</legend>
      {roles.map((r) => {
        const isLocked = locked.includes(r);
        return (
          <label key={r} className="flex min-h-11 items-start gap-3 rounded-md px-1 py-1 text-lg hover:bg-ground">
            <input
              type="checkbox"
              className="mt-0.5 size-6 shrink-0 accent-[rgb(var(--ink))]"
              checked={value.includes(r)}
              disabled={isLocked}
              onChange={(e) =>
                onChange(
                  e.target.checked ? roles.filter((x) => x === r || value.includes(x)) : value.filter((x) => x !== r),
                )
              }
            />
            <span>
              <span className="font-bold">{roleLabel[r]}</span>{' '}
              <span className="text-base text-muted">· {roleDuty[r]}</span>
              {isLocked ? (
                <span className="block text-sm text-muted">You cannot remove your own admin role.</span>
              ) : null}
            </span>
          </label>
        );
      })}
      {error ? (
        <p id={errorId} className="text-base font-bold text-major">
          <span aria-hidden="true">▲ </span>
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}
