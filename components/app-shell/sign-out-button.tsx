'use client';

import { signOut } from 'next-auth/react';

export function SignOutButton() {
  return (
    <button
      type="button"
      className="min-h-target rounded-lg border-slab border-edge bg-panel px-4 text-lg font-bold"
      onClick={() => void signOut({ callbackUrl: '/sign-in?signedOut=1' })}
    >
      Sign out
    </button>
  );
}
