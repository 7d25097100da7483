// The caches the service worker (app/sw.ts) keeps on the device for the signed-in account; the
// app empties them at sign-out so the next person on the phone does not see them.
export const deviceCacheNames = {
  pages: 'rigcall-pages',
  data: 'rigcall-driver-data',
} as const;

/** The page shown for a screen that is not kept on the device while there is no connection. */
export const offlinePath = '/offline';
