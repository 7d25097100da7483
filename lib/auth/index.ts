import 'server-only';
import { getServerSession, type Session } from 'next-auth';
import { cache } from 'react';
import { authOptions } from './config';

export { authOptions };

/** The signed-in user's session, or null; read once per request. */
export const auth = cache(async (): Promise<Session | null> => {
  const session = await getServerSession(authOptions);
  return session?.user?.id ? session : null;
});
