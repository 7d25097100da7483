'use client';

import { SerwistProvider } from '@serwist/turbopack/react';
import type { ReactNode } from 'react';
import { QueryProvider } from '@/components/providers/query-provider';

// The service worker (app/sw.ts) is registered in production builds only: under `next dev` it
// would keep stale code. It never reloads the page when the network comes back: a walk in
// progress stays on screen and its outbox sends by itself.
export function Providers({ children }: { children: ReactNode }) {
  return (
    <SerwistProvider
      swUrl="/serwist/sw.js"
      disable={process.env.NODE_ENV !== 'production'}
      reloadOnOnline={false}
      options={{ scope: '/' }}
    >
      <QueryProvider>{children}</QueryProvider>
    </SerwistProvider>
  );
}
