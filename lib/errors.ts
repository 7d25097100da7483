// One error type for the business layer and one table from its codes to HTTP statuses.
// Universal: the client's fetch wrapper reads the same codes back.

export const errorStatus = {
  invalid_json: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404, // also for another fleet's rows, so that existence does not leak
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  invalid_body: 422,
  rate_limited: 429,
  internal: 500,
  unavailable: 503, // a database limit was hit (a held lock, a slow statement, no free connection)
} as const;

export type ErrorCode = keyof typeof errorStatus;

export type ErrorBody = {
  error: { code: ErrorCode; message: string; fields?: Record<string, string[]> };
};

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly fields?: Record<string, string[]>;

  constructor(code: ErrorCode, message: string, fields?: Record<string, string[]>) {
    super(message);
    this.name = 'AppError';
    this.code = code;
    this.fields = fields;
  }

  get status(): number {
    return errorStatus[this.code];
  }

  toBody(): ErrorBody {
    return { error: { code: this.code, message: this.message, ...(this.fields ? { fields: this.fields } : {}) } };
  }
}

/**
 * A database error that means "busy, try again" rather than a fault: a lock not granted within
 * lock_timeout, a statement past statement_timeout, no free connection in time. Null otherwise.
 * Codes: https://www.postgresql.org/docs/current/errcodes-appendix.html
 */
export function findBusyDatabaseError(err: unknown): AppError | null {
  const code = (err as { code?: unknown } | null)?.code;
  const message = err instanceof Error ? err.message : '';
  const busy =
    code === '55P03' || // lock_not_available (lock_timeout)
    code === '57014' || // query_canceled (statement_timeout)
    code === '25P03' || // idle_in_transaction_session_timeout
    code === '53300' || // too_many_connections
    /timeout exceeded when trying to connect|Query read timeout|Connection terminated due to connection timeout/i.test(
      message,
    );
  return busy
    ? new AppError('unavailable', 'RigCall is busy right now and could not finish this in time. Try again in a moment.')
    : null;
}
