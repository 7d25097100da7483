import { describe, expect, it } from 'vitest';
import { flushQueue, type QueuedRequest, type QueueStore, type SendResult } from './flush-queue';

function memoryStore(items: QueuedRequest[]): QueueStore & { items: Map<string, QueuedRequest> } {
  const map = new Map(items.map((i) => [i.key, i]));
  return {
    items: map,
    list: async () => [...map.values()],
    put: async (i) => void map.set(i.key, i),
    remove: async (k) => void map.delete(k),
  };
}
const req = (key: string): QueuedRequest => ({
  key,
  label: key,
  url: `/x/${key}`,
  method: 'POST',
  json: {},
  state: 'pending',
  attempts: 0,
});

describe('flushQueue', () => {
  it('sends in device order and empties the queue', async () => {
    const store = memoryStore([req('003'), req('001'), req('002')]);
    const order: string[] = [];
    const out = await flushQueue(store, async (i) => (order.push(i.key), { ok: true }));
    expect(order).toEqual(['001', '002', '003']);
    expect(out).toMatchObject({ sent: 3, waiting: 0 });
    expect(store.items.size).toBe(0);
  });

  it('stops at the first network failure and keeps everything from there', async () => {
    const store = memoryStore([req('1'), req('2'), req('3')]);
    const out = await flushQueue(store, async (i): Promise<SendResult> =>
      i.key === '2' ? { ok: false, retry: true, status: 0, message: 'offline' } : { ok: true },
    );
    expect(out).toMatchObject({ sent: 1, waiting: 2, offline: true });
    expect([...store.items.keys()]).toEqual(['2', '3']);
    expect(store.items.get('2')?.attempts).toBe(1);
  });

  it('keeps a refused request with its message and goes on with the rest', async () => {
    const store = memoryStore([req('1'), req('2')]);
    const out = await flushQueue(store, async (i): Promise<SendResult> =>
      i.key === '1' ? { ok: false, retry: false, status: 422, message: 'A reading cannot be negative.' } : { ok: true },
    );
    expect(out).toMatchObject({ sent: 1, failed: 1 });
    expect(store.items.get('1')).toMatchObject({ state: 'failed', error: 'A reading cannot be negative.' });
  });

  it('does not resend a request already marked failed', async () => {
    const store = memoryStore([{ ...req('1'), state: 'failed' }, req('2')]);
    const sent: string[] = [];
    await flushQueue(store, async (i) => (sent.push(i.key), { ok: true }));
    expect(sent).toEqual(['2']);
  });

  it('keeps the server’s per-field details of a refusal, such as the steps a signature found missing', async () => {
    const store = memoryStore([req('1')]);
    await flushQueue(store, async (): Promise<SendResult> => ({
      ok: false,
      retry: false,
      status: 409,
      message: 'One step has not reached the server.',
      fields: { stepIds: ['s-7'] },
    }));
    expect(store.items.get('1')).toMatchObject({ state: 'failed', errorFields: { stepIds: ['s-7'] } });
  });
});
