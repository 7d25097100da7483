import 'server-only';
import { authOptions } from './config';

// next-auth's options, for its own endpoints (app/api/auth/[...nextauth]). Pages and handlers
// read the signed-in user through readSessionUser (lib/auth/read-session-user.ts) instead.
export { authOptions };
