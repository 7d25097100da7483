'use client';

import { useState, type FormEvent } from 'react';
import { buttonClass } from '@/components/ui/button';
import { ApiError, fetchJson } from '@/lib/http/fetch-json';
import { findPasswordProblem, passwordMinLength } from '@/lib/schemas/password';
import { slabInputClass } from '@/components/ui/field';
import { Panel } from '@/components/ui/panel';

const textOf = (v: FormDataEntryValue | null) => (typeof v === 'string' ? v : '');

type Props = { mode: 'change'; email: string; name: string } | { mode: 'reset'; token: string };

/**
 * A new password, typed twice: with the current one (change) or with a reset link's token.
 * The policy is checked here first and again by the server.
 */
export function NewPasswordForm(props: Props) {
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [done, setDone] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const currentPassword = textOf(form.get('currentPassword'));
    const newPassword = textOf(form.get('newPassword'));
    const repeat = textOf(form.get('repeatPassword'));
    const found: Record<string, string> = {};
    if (props.mode === 'change' && !currentPassword) found.currentPassword = 'Enter your current password.';
    const problem = findPasswordProblem(newPassword, props.mode === 'change' ? props : {});
    if (problem) found.newPassword = problem;
    else if (newPassword !== repeat) found.repeatPassword = 'The two new passwords differ. Type it again.';
    setErrors(found);
    setFailure(null);
    if (Object.keys(found).length) return;
    setBusy(true);
    try {
      if (props.mode === 'change')
        await fetchJson('/api/password', { method: 'PUT', json: { currentPassword, newPassword } });
      else await fetchJson('/api/password/reset', { method: 'POST', json: { token: props.token, newPassword } });
      setDone(true);
      if (props.mode === 'change') window.location.assign('/go');
    } catch (err) {
      if (err instanceof ApiError && err.fields)
        setErrors(Object.fromEntries(Object.entries(err.fields).map(([k, v]) => [k, v[0] ?? ''])));
      setFailure(err instanceof Error ? err.message : 'Something went wrong. Try again.');
    }
    setBusy(false);
  }

  if (done && props.mode === 'reset')
    return (
      <Panel as="p" role="status" className="text-lg">
        Your new password is set, and every other session has been signed out.{' '}
        <a href="/sign-in" className="font-bold underline">
          Sign in
        </a>{' '}
        with it.
      </Panel>
    );

  const hint = (id: string) =>
    errors[id] ? (
      <span id={`${id}-error`} className="text-base font-bold text-major">
        ▲ {errors[id]}
      </span>
    ) : null;

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate>
      {props.mode === 'change' ? (
        <>
          <input type="hidden" name="username" autoComplete="username" value={props.email} />
          <div className="flex flex-col gap-2 text-lg font-bold">
            <label htmlFor="currentPassword">Current password</label>
            <input
              id="currentPassword"
              name="currentPassword"
              type="password"
              autoComplete="current-password"
              required
              aria-invalid={!!errors.currentPassword}
              aria-describedby={errors.currentPassword ? 'currentPassword-error' : undefined}
              className={slabInputClass}
            />
            {hint('currentPassword')}
          </div>
        </>
      ) : null}
      <div className="flex flex-col gap-2 text-lg font-bold">
        <label htmlFor="newPassword">New password</label>
        <input
          id="newPassword"
          name="newPassword"
          type="password"
          autoComplete="new-password"
          required
          minLength={passwordMinLength}
          aria-invalid={!!errors.newPassword}
          aria-describedby={errors.newPassword ? 'newPassword-error' : 'newPassword-help'}
          className={slabInputClass}
        />
        <span id="newPassword-help" className="text-base font-normal text-muted">
          At least {passwordMinLength} characters. A few words with spaces are easy to type and hard to guess.
        </span>
        {hint('newPassword')}
      </div>
      <div className="flex flex-col gap-2 text-lg font-bold">
        <label htmlFor="repeatPassword">New password again</label>
        <input
          id="repeatPassword"
          name="repeatPassword"
          type="password"
          autoComplete="new-password"
          required
          aria-invalid={!!errors.repeatPassword}
          aria-describedby={errors.repeatPassword ? 'repeatPassword-error' : undefined}
          className={slabInputClass}
        />
        {hint('repeatPassword')}
      </div>
      {failure ? (
        <Panel as="p" role="alert" tone="major" className="text-lg font-bold text-major">
          <span aria-hidden="true">▲ </span>
          {failure}
        </Panel>
      ) : null}
      <button type="submit" className={buttonClass('primary')} disabled={busy}>
        {busy ? 'Saving…' : 'Save the new password'}
      </button>
    </form>
  );
}
