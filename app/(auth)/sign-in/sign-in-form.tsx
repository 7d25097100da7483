'use client';

import { signIn } from 'next-auth/react';
import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { findSafeNextPath } from '@/lib/http/find-safe-next-path';
import { Panel } from '@/components/ui/panel';
import { slabInputClass } from '@/components/ui/field';

const textOf = (v: FormDataEntryValue | null) => (typeof v === 'string' ? v : '');

export function SignInForm({ next }: { next: string }) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setBusy(true);
    setError(null);
    try {
      const res = await signIn('credentials', {
        email: textOf(form.get('email')),
        password: textOf(form.get('password')),
        redirect: false,
      });
      if (res?.ok && !res.error) {
        window.location.assign(findSafeNextPath(next, window.location.origin));
        return;
      }
      // A lock-out says so (and for how long), an expired invitation too; anything else is the same plain refusal.
      setError(
        res?.error && /too many|temporary password has expired/i.test(res.error)
          ? res.error
          : 'That e-mail and password do not match an active account. Check both and try again.',
      );
    } catch {
      setError('RigCall cannot be reached. Check the connection and try again.');
    }
    setBusy(false);
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate>
      <label className="flex flex-col gap-2 text-lg font-bold">
        E-mail
        <input
          name="email"
          type="email"
          autoComplete="username"
          inputMode="email"
          required
          className={slabInputClass}
        />
      </label>
      <label className="flex flex-col gap-2 text-lg font-bold">
        Password
        <input name="password" type="password" autoComplete="current-password" required className={slabInputClass} />
      </label>
      {error ? (
        <Panel as="p" role="alert" tone="major" className="text-lg font-bold text-major">
          <span aria-hidden="true">▲ </span>
          {error}
        </Panel>
      ) : null}
      <Button type="submit" tone="primary" disabled={busy}>
        {busy ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
