import { defineRoute } from '@/lib/api/define-route';
import { roles } from '@/lib/auth/roles';

export const GET = defineRoute({ roles }, ({ user }) => Promise.resolve(Response.json({ user })));
