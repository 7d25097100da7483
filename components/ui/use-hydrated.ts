'use client';

import { useSyncExternalStore } from 'react';

const subscribe = () => () => {};

/** False in the server's HTML, true once React runs in the browser: forms enable their submit then. */
export function useHydrated(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => true,
    () => false,
  );
}
