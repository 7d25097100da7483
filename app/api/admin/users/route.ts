import { defineRoute } from '@/lib/api/define-route';
import { getDb } from '@/lib/db';
import { listFleetUsers } from '@/lib/db/users';
import { inviteUserBodySchema } from '@/lib/schemas/users';
import { inviteUser } from '@/lib/services/people/invite-user';

/** Everyone in the admin's fleet. */
export const GET = defineRoute({ roles: ['admin'] }, async ({ user }) =>
  Response.json({ users: await listFleetUsers(getDb(), { fleetId: user.fleetId }) }),
);

/** Invite a person: an account with a temporary password, sent to them by e-mail. */
export const POST = defineRoute({ roles: ['admin'], body: inviteUserBodySchema }, async ({ user, body }) =>
  Response.json(await inviteUser({ fleetId: user.fleetId, actorId: user.id, ...body }), { status: 201 }),
);
