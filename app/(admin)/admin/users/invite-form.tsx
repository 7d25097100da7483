'use client';

import { useState, type FormEvent } from 'react';
import { Field, FormNotice, inputClass } from '@/components/ui/field';
import { useHydrated } from '@/components/ui/use-hydrated';
import { fieldsOfZod, firstError, readFailure, type FieldErrors } from '@/components/admin/form-errors';
import { useInviteUserMutation } from '@/lib/queries/admin';
import { inviteUserBodySchema, type Role } from '@/lib/schemas/users';
import { RoleChoices } from './role-choices';
import { buttonClass } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';

export function InviteForm() {
  const hydrated = useHydrated();
  const invite = useInviteUserMutation();
  const [name, setName] = useState('');
  const [email, setEmail] = useState('');
  const [roles, setRoles] = useState<Role[]>(['driver']);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);

  async function onSubmit(e: FormEvent) {
    e.preventDefault();
    setFailure(null);
    setSentTo(null);
    const body = { name, email, roles };
    const checked = inviteUserBodySchema.safeParse(body);
    if (!checked.success) {
      setErrors(fieldsOfZod(checked.error));
      return;
    }
    setErrors({});
    try {
      const { invitation } = await invite.mutateAsync(body);
      setSentTo(invitation.email);
      setName('');
      setEmail('');
      setRoles(['driver']);
    } catch (err) {
      const f = readFailure(err);
      setErrors(f.fields);
      setFailure(f.message);
    }
  }

  return (
    <section aria-labelledby="invite-heading" className={`${panelClass({ padding: 'none' })} flex flex-col gap-4 p-4`}>
      <div>
        <h2 id="invite-heading" className="text-2xl font-extrabold">
          Invite someone
        </h2>
        <p className="text-base text-muted">They get an e-mail with a temporary password to sign in with.</p>
      </div>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        <Field id="invite-name" label="Full name" error={firstError(errors, 'name')}>
          {(c) => (
            <input
              {...c}
              className={inputClass}
              value={name}
              onChange={(e) => setName(e.target.value)}
              autoComplete="off"
            />
          )}
        </Field>
        <Field id="invite-email" label="E-mail" error={firstError(errors, 'email')}>
          {(c) => (
            <input
              {...c}
              type="email"
              inputMode="email"
              className={inputClass}
              value={email}
              onChange={(e) => setEmail(e.target.value)}
              autoComplete="off"
            />
          )}
        </Field>
        <RoleChoices
          idPrefix="invite"
          value={roles}
          onChange={setRoles}
          error={firstError(errors, 'roles') ?? firstError(errors, 'roles.0')}
        />
        {failure ? <FormNotice kind="error">{failure}</FormNotice> : null}
        {sentTo ? <FormNotice kind="saved">Invitation sent to {sentTo}.</FormNotice> : null}
        <button type="submit" className={buttonClass('primary', 'compact')} disabled={invite.isPending || !hydrated}>
          {invite.isPending ? 'Sending…' : 'Send invitation'}
        </button>
      </form>
    </section>
  );
}
