import { z } from 'zod';

/** A record id in a path or body: a UUID (records are keyed by UUIDs, many made on the device). */
export const idSchema = z.uuid({ message: 'must be a record id (a UUID)' });

export const idParamsSchema = z.object({ id: idSchema });
export type IdParams = z.infer<typeof idParamsSchema>;
