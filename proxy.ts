import { NextResponse, type NextRequest } from 'next/server';
import { getToken } from 'next-auth/jwt';
import { env } from '@/lib/env';

// An early redirect for pages only; the real checks happen again on the
// server in every page (lib/auth/page-access.ts) and route handler
// (lib/api/handler.ts), which answer 401/403/404 themselves.
export async function proxy(request: NextRequest) {
  const token = await getToken({ req: request, secret: env.NEXTAUTH_SECRET });
  if (token) return NextResponse.next();
  const signIn = new URL('/sign-in', request.url);
  signIn.searchParams.set('callbackUrl', request.nextUrl.pathname);
  return NextResponse.redirect(signIn);
}

export const config = {
  // Everything except sign-in, invitation links, the API (which answers 401 itself) and public assets.
  matcher: ['/((?!sign-in|invitations/|api/|_next/|fonts/|favicon.ico).*)'],
};
