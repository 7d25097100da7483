'use client';
// The outbox on the device: IndexedDB, so that steps and photos survive a reload, a dead
// battery or a yard with no signal, until the server has them.
import { createStore, del, entries, set } from 'idb-keyval';
import type { QueuedRequest, QueueStore } from './flush-queue';

const outbox = typeof indexedDB === 'undefined' ? null : createStore('rigcall-outbox', 'requests');
let counter = 0;
const changed = () => window.dispatchEvent(new Event('rigcall-queue'));

export const deviceQueue: QueueStore = {
  list: async () => (outbox ? (await entries<string, QueuedRequest>(outbox)).map(([, v]) => v) : []),
  put: async (item) => {
    if (outbox) await set(item.key, item, outbox);
  },
  remove: async (key) => {
    if (outbox) await del(key, outbox);
  },
};

/** Queue one request; it is sent as soon as the network and the server allow. */
export async function enqueueRequest(r: Omit<QueuedRequest, 'key' | 'state' | 'attempts'>): Promise<void> {
  const key = `${Date.now().toString().padStart(15, '0')}-${(counter++).toString().padStart(6, '0')}`;
  await deviceQueue.put({ ...r, key, state: 'pending', attempts: 0 });
  changed();
}

export async function dropFailedRequest(key: string): Promise<void> {
  await deviceQueue.remove(key);
  changed();
}
