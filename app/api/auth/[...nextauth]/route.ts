import NextAuth from 'next-auth';
import { authOptions } from '@/lib/auth';

// next-auth 4 types its App Router handler loosely; it is a plain (Request, context) → Response handler.
const handler = NextAuth(authOptions) as (req: Request, ctx: unknown) => Promise<Response>;

export { handler as GET, handler as POST };
