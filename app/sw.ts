/// <reference lib="webworker" />
// The service worker, bundled by @serwist/turbopack (app/serwist/[path]/route.ts) and served at
// /serwist/sw.js with the scope "/". It keeps on the phone what a driver needs in a dead spot:
// - precached at install: Next's static files (the app shell's scripts and styles, the fonts, the
//   walk's code), the icons and the offline page;
// - kept while online, answered from the phone when the network does not answer within a few
//   seconds: the pages the driver opened, the fleet's units, each unit's review and the session;
// - nothing that writes: steps, photos and signatures go through the outbox (lib/inspection).
import {
  ExpirationPlugin,
  NetworkFirst,
  Serwist,
  type PrecacheEntry,
  type RouteMatchCallbackOptions,
  type SerwistGlobalConfig,
  type SerwistPlugin,
} from 'serwist';
import { deviceCacheNames, offlinePath } from '@/lib/offline/cache-names';

declare global {
  interface WorkerGlobalScope extends SerwistGlobalConfig {
    __SW_MANIFEST: (PrecacheEntry | string)[] | undefined;
  }
}
declare const self: ServiceWorkerGlobalScope;

// A session lasts at most 14 hours from sign-in; nothing kept for it should outlive that.
const keptSeconds = 14 * 60 * 60;

const driverData = ({ url, sameOrigin }: RouteMatchCallbackOptions) =>
  sameOrigin &&
  (url.pathname === '/api/units' ||
    url.pathname === '/api/me' ||
    url.pathname === '/api/inspections' ||
    /^\/api\/units\/[^/]+\/review$/.test(url.pathname));

// A page (not Next's own files, not the API, not a client-side navigation's RSC payload).
const page = ({ url, sameOrigin, request }: RouteMatchCallbackOptions) =>
  sameOrigin &&
  request.headers.get('RSC') !== '1' &&
  !url.searchParams.has('_rsc') &&
  !url.pathname.startsWith('/api/') &&
  !url.pathname.startsWith('/_next/') &&
  !url.pathname.startsWith('/serwist/') &&
  (request.mode === 'navigate' || request.destination === 'document' || request.destination === '');

// Only a page the server answered in full is kept: never a redirect (to sign-in, say) or an error.
const onlyWholePages: SerwistPlugin = {
  cacheWillUpdate: ({ response }) =>
    Promise.resolve(response.status === 200 && !response.redirected && response.type === 'basic' ? response : null),
};

// No network and no kept copy: "Open RigCall" (/go, the installed app's start) goes to the
// driver's home when it is kept; any other screen gets the precached offline page.
const whenOffline: SerwistPlugin = {
  handlerDidError: async ({ request }) => {
    const url = new URL(request.url);
    if (url.pathname === '/go' || url.pathname === '/') {
      const home = await caches.match('/driver', { cacheName: deviceCacheNames.pages });
      if (home) return Response.redirect(new URL('/driver', url).href, 302);
    }
    return request.destination === 'document' ? serwist.matchPrecache(offlinePath) : undefined;
  },
};

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  skipWaiting: true,
  clientsClaim: true,
  navigationPreload: false,
  runtimeCaching: [
    {
      matcher: driverData,
      handler: new NetworkFirst({
        cacheName: deviceCacheNames.data,
        networkTimeoutSeconds: 4,
        plugins: [new ExpirationPlugin({ maxEntries: 400, maxAgeSeconds: keptSeconds })],
      }),
    },
    {
      matcher: page,
      handler: new NetworkFirst({
        cacheName: deviceCacheNames.pages,
        networkTimeoutSeconds: 4,
        plugins: [onlyWholePages, whenOffline, new ExpirationPlugin({ maxEntries: 60, maxAgeSeconds: keptSeconds })],
      }),
    },
  ],
});

serwist.addEventListeners();
