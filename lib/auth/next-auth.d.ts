// What Layerwise keeps in the session token: our user id and the group the user is working in. Roles are NOT kept
// here: the guard reads them from the database on every request, so a changed role or a removal takes effect at once.
import "next-auth";
import "next-auth/jwt";

declare module "next-auth" {
  interface Session {
    user: { id: string; name: string; email: string };
    activeGroupId: string | null;
    /** User.sessionVersion when this session began; the guard refuses it once the user's version has moved on. */
    sessionVersion: number;
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    uid?: string;
    activeGroupId?: string | null;
    sv?: number;
  }
}
