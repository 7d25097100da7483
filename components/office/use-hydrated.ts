'use client';

import { useSyncExternalStore } from 'react';

const subscribe = () => () => {};

/** False in the server render and the first paint, true once the page is live: forms wait for it. */
export function useHydrated(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => true,
    () => false,
  );
}
