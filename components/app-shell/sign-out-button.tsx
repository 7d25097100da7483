'use client';

import { signOut } from 'next-auth/react';
import { Button } from '@/components/ui/button';
import { forgetDriverDataOnDevice } from '@/lib/offline/keep-driver-data';

export function SignOutButton() {
  return (
    <Button
      size="touch"
      onClick={() =>
        void forgetDriverDataOnDevice()
          .catch(() => undefined)
          .then(() => signOut({ callbackUrl: '/sign-in?signedOut=1' }))
      }
    >
      Sign out
    </Button>
  );
}
