import NextAuth from "next-auth";
import { authOptions } from "@/lib/auth/options";

// Options are built per request (cached after the first) so `next build` needs neither a secret nor a database.
type Context = { params: Promise<{ nextauth: string[] }> };

async function handler(request: Request, context: Context): Promise<Response> {
  const nextAuth = NextAuth(authOptions()) as (request: Request, context: Context) => Promise<Response>;
  return nextAuth(request, context);
}

export { handler as GET, handler as POST };
