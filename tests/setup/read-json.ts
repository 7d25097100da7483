// Typed reads of a handler's JSON answer, for integration and e2e tests (a fetch Response or a
// Playwright APIResponse: anything with json()).
import { z } from 'zod';
import { errorStatus, type ErrorBody, type ErrorCode } from '../../lib/errors';

type HasJson = { json(): Promise<unknown> };

/**
 * The JSON body, typed as the route answers it. The type argument is the test's statement of the
 * part of the contract it reads (dates arrive as ISO strings); the assertions then check the values.
 */
export async function readJson<T>(res: HasJson): Promise<T> {
  return (await res.json()) as T;
}

/** The JSON body parsed with a response schema (lib/schemas), so a body of another shape fails the test. */
export async function parseJson<S extends z.ZodType>(res: HasJson, schema: S): Promise<z.infer<S>> {
  return schema.parse(await res.json());
}

const errorCodes = Object.keys(errorStatus) as [ErrorCode, ...ErrorCode[]];

/** The one error shape of lib/errors.ts, checked at run time so a malformed error body fails the test. */
export const errorBodySchema = z.object({
  error: z.object({
    code: z.enum(errorCodes),
    message: z.string(),
    fields: z.record(z.string(), z.array(z.string())).optional(),
  }),
}) satisfies z.ZodType<ErrorBody>;

/** The `error` of an error answer (`{ error: { code, message, fields? } }`), parsed with its schema. */
export async function readError(res: HasJson): Promise<ErrorBody['error']> {
  return errorBodySchema.parse(await res.json()).error;
}
