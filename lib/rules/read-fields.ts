/**
 * Reading measurement fields from untrusted input (a JSON line, a request body). Each reader returns
 * the value or a `FieldError` with a message a person can act on; none of them throws.
 */
export type FieldError = { error: string };
export type Fields = Readonly<Record<string, unknown>>;

export function isFieldError(value: unknown): value is FieldError {
  return typeof value === 'object' && value !== null && 'error' in value;
}

function describe(value: unknown): string {
  if (value === null) return 'null';
  if (typeof value === 'string') return JSON.stringify(value.length > 40 ? `${value.slice(0, 40)}…` : value);
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  return Array.isArray(value) ? 'a list' : typeof value;
}

export type NumberOptions = {
  /** Zero allowed (default true). */
  allowZero?: boolean;
  integer?: boolean;
  unit?: string;
};

/** A required finite, non-negative number. */
export function readNumber(fields: Fields, name: string, options: NumberOptions = {}): number | FieldError {
  if (!(name in fields) || fields[name] === undefined) return { error: `missing field "${name}"` };
  return checkNumber(fields[name], name, options);
}

/** An optional number: undefined when absent or null. */
export function readOptionalNumber(
  fields: Fields,
  name: string,
  options: NumberOptions = {},
): number | undefined | FieldError {
  const value = fields[name];
  if (value === undefined || value === null) return undefined;
  return checkNumber(value, name, options);
}

function checkNumber(value: unknown, name: string, options: NumberOptions): number | FieldError {
  const unit = options.unit ? ` (${options.unit})` : '';
  if (typeof value !== 'number' || Number.isNaN(value)) {
    return { error: `"${name}" must be a number${unit}, got ${describe(value)}` };
  }
  if (!Number.isFinite(value)) return { error: `"${name}" must be a finite number${unit}` };
  if (value < 0) return { error: `"${name}" must not be negative, got ${value}` };
  if (options.allowZero === false && value === 0) return { error: `"${name}" must be greater than zero` };
  if (options.integer && !Number.isInteger(value)) return { error: `"${name}" must be a whole number, got ${value}` };
  return value;
}

/** A boolean; `fallback` when absent (required when no fallback is given). */
export function readBoolean(fields: Fields, name: string, fallback?: boolean): boolean | FieldError {
  const value = fields[name];
  if (value === undefined) {
    return fallback === undefined ? { error: `missing field "${name}" (true or false)` } : fallback;
  }
  if (typeof value !== 'boolean') return { error: `"${name}" must be true or false, got ${describe(value)}` };
  return value;
}

/** One of a fixed set of words (case-insensitive). */
export function readChoice<T extends string>(
  fields: Fields,
  name: string,
  choices: readonly T[],
  fallback?: T,
): T | FieldError {
  const value = fields[name];
  if (value === undefined || value === null) {
    return fallback ?? { error: `missing field "${name}" (one of ${choices.join(', ')})` };
  }
  if (typeof value !== 'string')
    return { error: `"${name}" must be one of ${choices.join(', ')}, got ${describe(value)}` };
  const found = choices.find((choice) => choice === value.trim().toLowerCase());
  return found ?? { error: `"${name}" must be one of ${choices.join(', ')}, got ${describe(value)}` };
}
