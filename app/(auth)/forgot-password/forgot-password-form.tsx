'use client';

import { useState, type FormEvent } from 'react';
import { buttonClass } from '@/components/ui/button';
import { fetchJson } from '@/lib/http/fetch-json';
import { slabInputClass } from '@/components/ui/field';
import { Panel } from '@/components/ui/panel';

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
      <Panel as="p" role="status" className="text-lg">
        {sent} The link works once, for an hour.
      </Panel>
    );
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
      {failure ? (
        <Panel as="p" role="alert" tone="major" className="text-lg font-bold text-major">
          <span aria-hidden="true">▲ </span>
          {failure}
        </Panel>
      ) : null}
      <button type="submit" className={buttonClass('primary')} disabled={busy}>
        {busy ? 'Sending…' : 'Send me a link'}
      </button>
    </form>
  );
}
