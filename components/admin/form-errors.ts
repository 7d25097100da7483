// Turning a failed check (zod on the client, or the API's `fields`) into messages per field.
import type { ZodError } from 'zod';
import { ApiError } from '@/lib/http/fetch-json';

export type FieldErrors = Record<string, string[]>;

export function fieldsOfZod(error: ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

/** The message and per-field messages of anything a mutation threw. */
export function readFailure(err: unknown): { message: string; fields: FieldErrors } {
  if (err instanceof ApiError) return { message: err.message, fields: err.fields ?? {} };
  return { message: 'Something went wrong. Try again.', fields: {} };
}

export const firstError = (fields: FieldErrors, key: string) => fields[key]?.[0];

/** A text field's value as a number for the API; text that is not a number is sent as is, for the server to explain. */
export function numberOrNull(text: string): number | string | null {
  const t = text.trim();
  if (t === '') return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : t;
}
