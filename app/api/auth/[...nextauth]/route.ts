import NextAuth from 'next-auth';
import { authOptions } from '@/server/auth/options';

export const dynamic = 'force-dynamic';

// Built per request so that NEXTAUTH_URL and the secret are read at run time, not at build time.
async function handler(req: Request, context: { params: Promise<{ nextauth: string[] }> }) {
  return NextAuth(req as never, context as never, authOptions());
}

export { handler as GET, handler as POST };
