import 'server-only';
import type { ZodType, z } from 'zod';
import { AppError } from '@/lib/errors';

/** zod issues → readable per-field messages, for a form to show beside each field. */
export function fieldsFromZod(error: z.ZodError): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

/** Parse with zod, or throw a 422 whose message names the first bad field. `what`: "Address", "Query", "Request". */
export function parseOrThrow<T>(schema: ZodType<T>, value: unknown, what: string): T {
  const r = schema.safeParse(value);
  if (r.success) return r.data;
  const fields = fieldsFromZod(r.error);
  const first = Object.entries(fields)[0];
  const message = first ? `${what}: ${first[0] === '_' ? '' : `${first[0]}: `}${first[1][0]}` : `${what} is not valid`;
  throw new AppError('invalid_body', message, fields);
}
