import type { ErrorBody, ErrorCode } from '@/lib/errors';

/** A failed API call, with the server's message for a person to read. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: ErrorCode | 'network';
  readonly fields?: Record<string, string[]>;

  constructor(status: number, code: ErrorCode | 'network', message: string, fields?: Record<string, string[]>) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
  }

  /** Worth trying again later (offline, server away), as opposed to a request to fix. */
  get retryable(): boolean {
    return this.code === 'network' || this.status >= 500 || this.status === 429;
  }
}

/** How long a call waits for the server before it gives up (the phone keeps what it was sending). */
export const defaultTimeoutMs = 20_000;

/** A signal that aborts after `ms`, or when `outer` aborts. */
export function timeoutSignal(ms: number, outer?: AbortSignal | null): AbortSignal {
  const timer = AbortSignal.timeout(ms);
  return outer ? AbortSignal.any([outer, timer]) : timer;
}

const isTimeout = (err: unknown) => err instanceof DOMException && err.name === 'TimeoutError';

export async function fetchJson<T>(
  url: string,
  init: RequestInit & { json?: unknown; timeoutMs?: number } = {},
): Promise<T> {
  const { json, headers, timeoutMs = defaultTimeoutMs, signal, ...rest } = init;
  let res: Response;
  let text: string;
  try {
    res = await fetch(url, {
      ...rest,
      signal: timeoutSignal(timeoutMs, signal),
      headers: {
        accept: 'application/json',
        ...(json !== undefined ? { 'content-type': 'application/json' } : {}),
        ...headers,
      },
      body: json !== undefined ? JSON.stringify(json) : rest.body,
    });
    text = await res.text();
  } catch (err) {
    if (signal?.aborted) throw err;
    if (isTimeout(err))
      throw new ApiError(
        0,
        'network',
        `RigCall did not answer within ${Math.round(timeoutMs / 1000)} seconds. What you entered is kept; try again.`,
      );
    throw new ApiError(0, 'network', 'No connection to RigCall right now. What you entered is kept and will be sent.');
  }
  let body: unknown = null;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    body = null;
  }
  if (!res.ok) {
    const err = (body as ErrorBody | null)?.error;
    throw new ApiError(
      res.status,
      err?.code ?? 'internal',
      err?.message ?? `The server answered ${res.status}.`,
      err?.fields,
    );
  }
  return body as T;
}
