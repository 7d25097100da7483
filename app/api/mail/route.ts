import { z } from 'zod';
import { defineRoute } from '@/lib/api/define-route';
import { listCaughtMessages } from '@/lib/services/mail/list-caught-messages';

const query = z.object({ to: z.string().email().optional() });

// What the local mail catcher received for the admin's fleet (no mail provider's inbox is ever read).
export const GET = defineRoute({ roles: ['admin'], query }, async ({ user, query: q }) =>
  Response.json(await listCaughtMessages({ fleetId: user.fleetId, to: q.to })),
);
