// The signed-in user, as pages, route handlers and the header bar see it. Universal.
import { z } from 'zod';
import { roleSchema } from './users';

export const sessionUserSchema = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string(),
  fleetId: z.string(),
  roles: z.array(roleSchema),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;
