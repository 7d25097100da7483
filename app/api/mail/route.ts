import { z } from 'zod';
import { defineRoute } from '@/lib/api/define-route';
import { listCaughtMessages } from '@/lib/services/mail/list-caught-messages';

const query = z.object({ to: z.string().email().optional() });

// What the local mail catcher received (no mail provider's inbox is ever read).
export const GET = defineRoute({ roles: ['admin'], query }, async ({ query: q }) =>
  Response.json(await listCaughtMessages({ to: q.to })),
);
