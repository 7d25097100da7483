'use client';

import { useState, type FormEvent } from 'react';
import { buttonClass } from '@/components/ui/button';
import { fetchJson } from '@/lib/http/fetch-json';

const field =
  'min-h-target w-full rounded-lg border-slab border-edge bg-panel px-4 text-xl text-ink placeholder:text-muted';

export function ForgotPasswordForm() {
  const [sent, setSent] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const email = new FormData(e.currentTarget).get('email');
    setBusy(true);
    setFailure(null);
    try {
      const out = await fetchJson<{ message: string }>('/api/password/forgot', {
        method: 'POST',
        json: { email: typeof email === 'string' ? email : '' },
      });
      setSent(out.message);
    } catch (err) {
      setFailure(err instanceof Error ? err.message : 'Something went wrong. Try again.');
    }
    setBusy(false);
  }

  if (sent)
    return (
      <p role="status" className="rounded-lg border-slab border-edge bg-panel p-4 text-lg">
        {sent} The link works once, for an hour.
      </p>
    );
  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate>
      <label className="flex flex-col gap-2 text-lg font-bold">
        E-mail
        <input name="email" type="email" autoComplete="username" inputMode="email" required className={field} />
      </label>
      {failure ? (
        <p role="alert" className="rounded-lg border-slab border-major bg-panel p-4 text-lg font-bold text-major">
          <span aria-hidden="true">▲ </span>
          {failure}
        </p>
      ) : null}
      <button type="submit" className={buttonClass('primary')} disabled={busy}>
        {busy ? 'Sending…' : 'Send me a link'}
      </button>
    </form>
  );
}
