import NextAuth from 'next-auth';
import { getAuthOptions } from '@/lib/server/auth/options';

export const dynamic = 'force-dynamic';

// next-auth's own endpoints (sign-in, callback, csrf, sign-out); not part of the /api/v1 registry.
type Handler = (req: Request, ctx: { params: Promise<{ nextauth: string[] }> }) => Promise<Response>;
const handler: Handler = (req, ctx) => (NextAuth(getAuthOptions()) as unknown as Handler)(req, ctx);

export { handler as GET, handler as POST };
