import { getToken } from 'next-auth/jwt';
import { NextResponse, type NextRequest } from 'next/server';
import { buildContentSecurityPolicy, makeNonce } from '@/lib/http/content-security-policy';
import { findSafeNextPath } from '@/lib/http/find-safe-next-path';

const signedInAreas = ['/driver', '/mechanic', '/supervisor', '/trainer', '/admin'];
const inArea = (path: string) => signedInAreas.some((a) => path === a || path.startsWith(`${a}/`));

// Every answer gets a content security policy with a fresh nonce (Next reads it from the request's
// policy header for its own inline scripts). Signed-out people are sent to the sign-in page from
// the signed-in areas; every page and route handler checks the session and the role itself, so
// this is never the only check.
export async function proxy(req: NextRequest) {
  const nonce = makeNonce();
  const csp = buildContentSecurityPolicy(nonce, { dev: process.env.NODE_ENV === 'development' });
  const path = req.nextUrl.pathname;
  if (inArea(path)) {
    const token = await getToken({ req, secret: process.env.NEXTAUTH_SECRET });
    if (!token) {
      const url = req.nextUrl.clone();
      url.pathname = '/sign-in';
      url.search = `?next=${encodeURIComponent(findSafeNextPath(path + req.nextUrl.search, req.nextUrl.origin))}`;
      const res = NextResponse.redirect(url);
      res.headers.set('Content-Security-Policy', csp);
      return res;
    }
  }
  const headers = new Headers(req.headers);
  headers.set('x-nonce', nonce);
  headers.set('Content-Security-Policy', csp);
  const res = NextResponse.next({ request: { headers } });
  res.headers.set('Content-Security-Policy', csp);
  return res;
}

export const config = {
  // Everything but Next's static files (their policy comes from next.config.mjs).
  matcher: ['/((?!_next/static|_next/image).*)'],
};
