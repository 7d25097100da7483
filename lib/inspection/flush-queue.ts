// Sends what the device queued, oldest first, one request at a time. Storage and network are
// passed in, so the same logic runs over IndexedDB in the browser and over a Map in tests.

export type QueuedRequest = {
  /** Sort key: the order things happened on the device. */
  key: string;
  /** What the request creates (a step, a photo, the signature): shown to the driver. */
  label: string;
  url: string;
  method: 'POST' | 'PUT';
  json?: unknown;
  blob?: Blob;
  state: 'pending' | 'failed';
  error?: string;
  /** The server's per-field details of a refusal (the steps a signature found missing). */
  errorFields?: Record<string, string[]>;
  attempts: number;
  /** How many times a refused signature was sent again after the missing steps. */
  resendRound?: number;
};

export type QueueStore = {
  list: () => Promise<QueuedRequest[]>;
  put: (item: QueuedRequest) => Promise<void>;
  remove: (key: string) => Promise<void>;
};

export type SendResult =
  { ok: true } | { ok: false; retry: boolean; status: number; message: string; fields?: Record<string, string[]> };

export type FlushOutcome = {
  sent: number;
  failed: number;
  waiting: number;
  offline: boolean;
  lastError: string | null;
};

/**
 * Send pending requests in order. A request the server accepted (2xx) leaves the queue. One it
 * refused for good (4xx) is kept as failed with the server's message, and the rest go on. When
 * the network or the server is away (no answer, 5xx, 429) flushing stops and everything stays.
 */
export async function flushQueue(
  store: QueueStore,
  send: (item: QueuedRequest) => Promise<SendResult>,
): Promise<FlushOutcome> {
  const items = (await store.list()).sort((a, b) => a.key.localeCompare(b.key));
  let sent = 0;
  let failed = 0;
  for (const [i, item] of items.entries()) {
    if (item.state === 'failed') {
      failed++;
      continue;
    }
    const result = await send(item);
    if (result.ok) {
      await store.remove(item.key);
      sent++;
      continue;
    }
    if (result.retry) {
      await store.put({ ...item, attempts: item.attempts + 1, error: result.message });
      const waiting = items.slice(i).filter((x) => x.state === 'pending').length;
      return { sent, failed, waiting, offline: result.status === 0, lastError: result.message };
    }
    await store.put({
      ...item,
      state: 'failed',
      attempts: item.attempts + 1,
      error: result.message,
      ...(result.fields ? { errorFields: result.fields } : {}),
    });
    failed++;
  }
  return { sent, failed, waiting: 0, offline: false, lastError: null };
}

/** How long one queued step waits for an answer; a photo (up to 15 MB on a weak signal) waits longer. */
export const stepTimeoutMs = 20_000;
export const photoTimeoutMs = 120_000;

/** One queued request over fetch, with the server's error message when it refuses. */
export async function sendQueued(
  item: QueuedRequest,
  { timeoutMs = item.blob ? photoTimeoutMs : stepTimeoutMs }: { timeoutMs?: number } = {},
): Promise<SendResult> {
  let res: Response;
  try {
    res = await fetch(item.url, {
      signal: AbortSignal.timeout(timeoutMs),
      method: item.method,
      headers: item.blob
        ? { 'content-type': item.blob.type || 'application/octet-stream' }
        : { 'content-type': 'application/json' },
      body: item.blob ?? JSON.stringify(item.json),
    });
  } catch (err) {
    if (err instanceof DOMException && err.name === 'TimeoutError')
      return {
        ok: false,
        retry: true,
        status: 0,
        message: `RigCall did not answer within ${Math.round(timeoutMs / 1000)} seconds. Saved on this phone; it will be sent.`,
      };
    return { ok: false, retry: true, status: 0, message: 'No connection. Saved on this phone; it will be sent.' };
  }
  if (res.ok) {
    if (item.url.endsWith('/steps')) await announceStepAnswer(res);
    return { ok: true };
  }
  let message = `The server answered ${res.status}.`;
  let fields: Record<string, string[]> | undefined;
  try {
    const body = (await res.json()) as { error?: { message?: string; fields?: Record<string, string[]> } };
    message = body.error?.message ?? message;
    fields = body.error?.fields;
  } catch {
    /* not JSON */
  }
  const retry = res.status >= 500 || res.status === 429 || res.status === 401;
  return {
    ok: false,
    retry,
    status: res.status,
    message:
      retry && res.status >= 500 ? 'RigCall’s server is not answering. Saved on this phone; it will be sent.' : message,
    ...(fields ? { fields } : {}),
  };
}

/** What the server recorded for a step (its verdict on a reading is the one of record). */
export type StepAnswer = {
  id: string;
  verdict: 'pass' | 'fail' | null;
  severity: 'minor' | 'major' | null;
  limitText: string | null;
  source: string | null;
};

/** Tell the walk screen what the server recorded, so it can show the server's verdict. */
async function announceStepAnswer(res: Response) {
  if (typeof window === 'undefined') return;
  try {
    const body = (await res.json()) as { step?: StepAnswer };
    if (body.step?.id) window.dispatchEvent(new CustomEvent<StepAnswer>('rigcall-step-answer', { detail: body.step }));
  } catch {
    /* not JSON: nothing to show */
  }
}
