// Reads who is asking from the current request: an "Authorization: Bearer lw_…" header wins over the session
// cookie, and a malformed Authorization header is refused rather than ignored.
import { headers } from "next/headers";
import { getServerSession } from "next-auth";
import { authOptions } from "@/lib/auth/options";
import { UnauthenticatedError } from "@/lib/errors";
import { type Credentials } from "@/lib/authz/guard";

export async function requestCredentials(): Promise<Credentials | null> {
  const authorization = (await headers()).get("authorization");
  if (authorization !== null) {
    const match = /^Bearer\s+(\S+)\s*$/i.exec(authorization);
    if (!match?.[1]) throw new UnauthenticatedError('Send API tokens as "Authorization: Bearer lw_…".');
    return { kind: "token", token: match[1] };
  }
  const session = await getServerSession(authOptions());
  if (!session?.user.id) return null;
  return { kind: "session", userId: session.user.id, activeGroupId: session.activeGroupId, sessionVersion: session.sessionVersion };
}
