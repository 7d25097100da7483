'use client';

import { signOut } from 'next-auth/react';
import { Button } from '@/components/ui/button';

export function SignOutButton() {
  return (
    <Button size="touch" onClick={() => void signOut({ callbackUrl: '/sign-in?signedOut=1' })}>
      Sign out
    </Button>
  );
}
