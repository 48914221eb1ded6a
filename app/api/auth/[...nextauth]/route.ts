import NextAuth from 'next-auth';
import { authOptions } from '@/lib/auth/options';

// GET|POST /api/auth/* – next-auth's sign-in, callback, session and sign-out endpoints
async function handler(req: Request, ctx: { params: Promise<{ nextauth: string[] }> }) {
  return NextAuth(req as never, ctx as never, authOptions());
}

export { handler as GET, handler as POST };
