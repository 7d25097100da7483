// People and roles, as the admin screens and /api/admin/users speak them. Universal.
import { z } from 'zod';
import { roles } from '@/lib/auth/roles';

// Re-exported so client components reach the role list through a universal module.
export { roleLabel, roles, type Role } from '@/lib/auth/roles';

/** An e-mail address, trimmed and lower-cased (sign-in compares lower case). */
export const emailSchema = z
  .string('Enter an e-mail address.')
  .trim()
  .toLowerCase()
  .max(254, 'An e-mail address is at most 254 characters.')
  .pipe(z.email('Enter an e-mail address like name@company.com.'));

/** An optional e-mail: an empty field means "none". */
export const optionalEmailSchema = z.union([z.literal('').transform(() => null), z.null(), emailSchema]).optional();

export const roleSchema = z.enum(roles, { error: `Pick roles from the list: ${roles.join(', ')}.` });

const rolesSchema = z
  .array(roleSchema, 'Give the roles as a list.')
  .min(1, 'Give at least one role.')
  .transform((list) => roles.filter((r) => list.includes(r)));

const nameSchema = z
  .string("Enter the person's name.")
  .trim()
  .min(1, "Enter the person's name.")
  .max(120, 'Keep the name under 120 characters.');

export const inviteUserBodySchema = z.object({
  name: nameSchema,
  email: emailSchema,
  roles: rolesSchema,
});
export type InviteUserBody = z.input<typeof inviteUserBodySchema>;

export const updateUserBodySchema = z
  .object({
    name: nameSchema.optional(),
    roles: rolesSchema.optional(),
    active: z.boolean('Say true or false for active.').optional(),
  })
  .refine((b) => b.name !== undefined || b.roles !== undefined || b.active !== undefined, {
    message: 'Nothing to change: send a name, roles or active.',
  });
export type UpdateUserBody = z.input<typeof updateUserBodySchema>;

export const userParamsSchema = z.object({ id: z.uuid('That is not a user id.') });

export const adminUserSchema = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string(),
  roles: z.array(roleSchema),
  active: z.boolean(),
  mustChangePassword: z.boolean(),
  lastSignInAt: z.string().nullable(),
  createdAt: z.string(),
});
export type AdminUser = z.infer<typeof adminUserSchema>;
