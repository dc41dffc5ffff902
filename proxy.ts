import { getToken } from 'next-auth/jwt';
import { NextResponse, type NextRequest } from 'next/server';
import { DEV_SECRET } from '@/lib/env';

/**
 * First layer of access: signed-out visitors go to the sign-in page (pages) or get 401 (API).
 * Project roles are checked again by every page, route handler and server action.
 */
export async function proxy(request: NextRequest) {
  const token = await getToken({ req: request, secret: process.env.NEXTAUTH_SECRET ?? DEV_SECRET });
  if (token) return NextResponse.next();
  if (request.nextUrl.pathname.startsWith('/api/')) {
    return NextResponse.json({ error: 'Sign in first.' }, { status: 401 });
  }
  const url = request.nextUrl.clone();
  url.pathname = '/sign-in';
  url.search = `?callbackUrl=${encodeURIComponent(request.nextUrl.pathname + request.nextUrl.search)}`;
  return NextResponse.redirect(url);
}

export const config = {
  // Everything except sign-in, next-auth's own routes, static files and the shipped assets.
  matcher: ['/((?!sign-in|api/auth|_next/static|_next/image|favicon.ico|samples/).*)'],
};
