'use client';

import { useState } from 'react';
import { FormNotice } from '@/components/ui/field';
import { firstError, readFailure, type FieldErrors } from '@/components/admin/form-errors';
import { useUpdateUserMutation } from '@/lib/queries/admin';
import { roleLabel, type AdminUser, type Role } from '@/lib/schemas/users';
import { RoleChoices } from './role-choices';
import { buttonClass } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';

const dateFormat = new Intl.DateTimeFormat('en-US', { day: 'numeric', month: 'short', year: 'numeric' });

/** One person in the roster, with an editor for roles and for deactivating. */
export function PersonRow({ person, isSelf }: { person: AdminUser; isSelf: boolean }) {
  const update = useUpdateUserMutation();
  const [open, setOpen] = useState(false);
  const [roles, setRoles] = useState<Role[]>(person.roles);
  const [confirming, setConfirming] = useState(false);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const editorId = `person-${person.id}-editor`;

  async function save(change: { roles?: Role[]; active?: boolean }, done: string) {
    setFailure(null);
    setSaved(null);
    try {
      await update.mutateAsync({ id: person.id, ...change });
      setErrors({});
      setConfirming(false);
      setSaved(done);
    } catch (err) {
      const f = readFailure(err);
      setErrors(f.fields);
      setFailure(f.message);
    }
  }

  return (
    <li className={`border-b-2 border-edge/30 py-3 last:border-b-0 ${person.active ? '' : 'opacity-80'}`}>
      <div className="grid grid-cols-1 gap-2 md:grid-cols-[minmax(0,1fr)_minmax(0,13rem)_10rem_auto] md:items-center md:gap-4">
        <div className="min-w-0">
          <p className="truncate text-lg font-bold">
            {person.name}
            {isSelf ? <span className="ml-2 text-base font-normal text-muted">(you)</span> : null}
          </p>
          <p className="text-base [overflow-wrap:anywhere] text-muted">{person.email}</p>
        </div>
        <ul className="flex flex-wrap gap-1" aria-label={`Roles of ${person.name}`}>
          {person.roles.map((r) => (
            <li key={r} className="rounded border-2 border-edge px-2 text-base font-bold">
              {roleLabel[r]}
            </li>
          ))}
        </ul>
        <div className="text-base md:text-right">
          {person.active ? (
            person.mustChangePassword && !person.lastSignInAt ? (
              <span className="font-bold">Invited</span>
            ) : (
              <span>
                <span aria-hidden="true" className="text-pass">
                  ✓{' '}
                </span>
                Active
              </span>
            )
          ) : (
            <span className="font-bold text-muted">Deactivated</span>
          )}
          <span className="block text-sm text-muted" suppressHydrationWarning>
            {person.lastSignInAt
              ? `Last signed in ${dateFormat.format(new Date(person.lastSignInAt))}`
              : 'Never signed in'}
          </span>
        </div>
        <button
          type="button"
          className={buttonClass('plain', 'compact')}
          aria-expanded={open}
          aria-controls={editorId}
          aria-label={`${open ? 'Close' : 'Change'} ${person.name}`}
          onClick={() => {
            setOpen(!open);
            setRoles(person.roles);
            setConfirming(false);
            setFailure(null);
            setSaved(null);
          }}
        >
          {open ? 'Close' : 'Change'}
        </button>
      </div>

      {open ? (
        <div id={editorId} className="mt-3 grid gap-4 rounded-md border-2 border-edge bg-ground p-3 md:grid-cols-2">
          <div className="flex flex-col gap-3">
            <RoleChoices
              idPrefix={`person-${person.id}`}
              value={roles}
              onChange={setRoles}
              locked={isSelf ? ['admin'] : []}
              error={firstError(errors, 'roles')}
            />
            <button
              type="button"
              className={buttonClass('primary', 'compact')}
              disabled={update.isPending || roles.length === 0 || roles.join() === person.roles.join()}
              onClick={() => void save({ roles }, 'Roles saved.')}
            >
              Save roles
            </button>
          </div>
          <div className="flex flex-col gap-3">
            <p className="text-base font-bold">Account</p>
            {isSelf ? (
              <p className="text-base text-muted">You cannot deactivate your own account. Another admin can.</p>
            ) : person.active ? (
              confirming ? (
                <div className={`flex flex-col gap-2 ${panelClass({ tone: 'major', padding: 'sm' })}`}>
                  <p className="text-lg">
                    Deactivate <b>{person.name}</b>? They can no longer sign in. Their inspections and records stay.
                  </p>
                  <div className="flex flex-wrap gap-2">
                    <button
                      type="button"
                      className={buttonClass('danger', 'compact')}
                      disabled={update.isPending}
                      onClick={() => void save({ active: false }, 'Deactivated.')}
                    >
                      Yes, deactivate
                    </button>
                    <button
                      type="button"
                      className={buttonClass('plain', 'compact')}
                      onClick={() => setConfirming(false)}
                    >
                      Keep active
                    </button>
                  </div>
                </div>
              ) : (
                <button type="button" className={buttonClass('plain', 'compact')} onClick={() => setConfirming(true)}>
                  Deactivate…
                </button>
              )
            ) : (
              <button
                type="button"
                className={buttonClass('plain', 'compact')}
                disabled={update.isPending}
                onClick={() => void save({ active: true }, 'Reactivated.')}
              >
                Reactivate
              </button>
            )}
            {failure ? <FormNotice kind="error">{failure}</FormNotice> : null}
            {saved ? <FormNotice kind="saved">{saved}</FormNotice> : null}
          </div>
        </div>
      ) : null}
    </li>
  );
}
