'use client';
// Asks the service worker (app/sw.ts) to keep what a driver needs to start a walk without a
// connection: the home and start screens, the fleet's units, each unit's review (the last report
// and its repairs) and the session. The worker fetches them; its network-first rules store them.
import { deviceCacheNames } from './cache-names';

const everyMs = 10 * 60 * 1000;
const batch = 20;
let last = 0;
let running = false;

type UnitsAnswer = { units: { id: string }[] };

export async function keepDriverDataOnDevice(): Promise<void> {
  if (running || Date.now() - last < everyMs) return;
  if (!('serviceWorker' in navigator) || !navigator.onLine) return;
  running = true;
  try {
    const registration = await navigator.serviceWorker.ready;
    const worker = registration.active;
    if (!worker) return;
    const res = await fetch('/api/units', { headers: { accept: 'application/json' } });
    if (!res.ok) return;
    const { units } = (await res.json()) as UnitsAnswer;
    const urls = [
      '/driver',
      '/driver/start',
      '/driver/start?kind=post_trip',
      '/api/me',
      '/api/units',
      ...units.map((u) => `/api/units/${encodeURIComponent(u.id)}/review`),
    ];
    for (let i = 0; i < urls.length; i += batch) {
      await askWorker(worker, urls.slice(i, i + batch));
    }
    last = Date.now();
  } catch {
    // No worker yet, or the network went: the next time online tries again.
  } finally {
    running = false;
  }
}

/** The worker answers on the channel once every URL of the batch is fetched and stored. */
function askWorker(worker: ServiceWorker, urlsToCache: string[]): Promise<void> {
  return new Promise((resolve) => {
    const channel = new MessageChannel();
    const timer = window.setTimeout(resolve, 30_000);
    channel.port1.onmessage = () => {
      window.clearTimeout(timer);
      resolve();
    };
    worker.postMessage({ type: 'CACHE_URLS', payload: { urlsToCache } }, [channel.port2]);
  });
}

/** At sign-out: what was kept for this account leaves the phone. */
export async function forgetDriverDataOnDevice(): Promise<void> {
  last = 0;
  if (typeof caches === 'undefined') return;
  await Promise.all(Object.values(deviceCacheNames).map((name) => caches.delete(name)));
}
