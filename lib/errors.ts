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
