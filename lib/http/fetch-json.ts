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

export async function fetchJson<T>(url: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const { json, headers, ...rest } = init;
  let res: Response;
  try {
    res = await fetch(url, {
      ...rest,
      headers: {
        accept: 'application/json',
        ...(json !== undefined ? { 'content-type': 'application/json' } : {}),
        ...headers,
      },
      body: json !== undefined ? JSON.stringify(json) : rest.body,
    });
  } catch {
    throw new ApiError(0, 'network', 'No connection to RigCall right now. What you entered is kept and will be sent.');
  }
  const text = await res.text();
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
