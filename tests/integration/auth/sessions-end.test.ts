// Sessions that end, and tokens that open only the API. Before: a copy of the session cookie taken before sign-out
// still got 200 on /api/v1/me for up to 7 days; API tokens never expired and also opened pages and server actions;
// /settings/api-tokens with a Bearer token answered 500 instead of 403.
import "@/tests/integration/api/next-runtime";
import { beforeAll, expect, it } from "vitest";
import * as me from "@/app/api/v1/me/route";
import { createApiToken, tokenExpiry } from "@/lib/auth/api-tokens/tokens";
import { authOptions } from "@/lib/auth/options";
import { hashPassword } from "@/lib/auth/password";
import { changePassword } from "@/lib/auth/password-change";
import { currentSessionVersion } from "@/lib/auth/sessions";
import { liftMemberSignInDelay } from "@/lib/auth/sign-in-delay";
import { FREE_FAILURES_PER_ACCOUNT, attemptKeys, reserveSignInAttempt, settleSignInAttempt } from "@/lib/auth/rate-limit";
import { signInWithPassword } from "@/lib/auth/sign-in";
import { memberAction } from "@/lib/authz/action";
import { SESSION_ENDED_MESSAGE, resolveMember } from "@/lib/authz/guard";
import { requirePageMember } from "@/lib/authz/page";
import { ForbiddenError, ValidationError } from "@/lib/errors";
import { removeMember } from "@/lib/groups/members";
import { callRoute, tokenFor } from "@/tests/integration/api/call";
import { sessionCookieHeader } from "@/tests/integration/api/session-cookie";
import { describeWithAppDatabase } from "./app-database";
import { makeGroup, makeMember, sessionOf } from "./fixtures";

type ErrorJson = { error: { message: string } };
const PASSWORD = "rotary-evaporator-31"; // invented

describeWithAppDatabase("sessions that end", (t) => {
  let groupId = "";
  let leadId = "";

  beforeAll(async () => {
    const group = await makeGroup(t.db, "Session Lab");
    groupId = group.id;
    leadId = (await makeMember(t.db, groupId, "lead", "Session Lead")).user.id;
  });

  async function cookieFor(userId: string): Promise<string> {
    return sessionCookieHeader({ uid: userId, activeGroupId: groupId, sv: await currentSessionVersion(userId), email: "x@example.org", name: "X" });
  }
  const meWith = (cookie: string) => callRoute(me.GET, "GET", "/api/v1/me", { headers: { cookie } });

  it("sign-out ends the session: a copy of the cookie taken before it gets 401", async () => {
    const { user } = await makeMember(t.db, groupId, "member", "Signing Out");
    const cookie = await cookieFor(user.id);
    expect((await meWith(cookie)).status).toBe(200);
    await authOptions().events!.signOut!({ token: { uid: user.id }, session: null as never });
    const after = await meWith(cookie);
    expect(after.status).toBe(401);
    expect(((await after.json()) as ErrorJson).error.message).toBe(SESSION_ENDED_MESSAGE);
    // A fresh sign-in carries the new version and works.
    expect((await meWith(await cookieFor(user.id))).status).toBe(200);
  });

  it("a password change ends existing sessions; a wrong current password changes nothing", async () => {
    const { user } = await makeMember(t.db, groupId, "member", "Changing Password");
    await t.db.user.update({ where: { id: user.id }, data: { passwordHash: await hashPassword(PASSWORD) } });
    const cookie = await cookieFor(user.id);
    const next = "distillation-head-58";
    await expect(changePassword(user, { currentPassword: "not-the-password", newPassword: next, confirmPassword: next })).rejects.toBeInstanceOf(ValidationError);
    expect((await meWith(cookie)).status).toBe(200);
    await expect(changePassword(user, { currentPassword: PASSWORD, newPassword: user.email, confirmPassword: user.email })).rejects.toBeInstanceOf(ValidationError);
    await changePassword(user, { currentPassword: PASSWORD, newPassword: next, confirmPassword: next });
    expect((await meWith(cookie)).status).toBe(401);
    expect(await signInWithPassword({ email: user.email, password: next }, "10.7.0.1")).toMatchObject({ id: user.id });
    expect(await signInWithPassword({ email: user.email, password: PASSWORD }, "10.7.0.1")).toBeNull();
  });

  it("removal from a group ends the removed person's sessions, even where they still belong to another group", async () => {
    const other = await makeGroup(t.db, "Other Lab");
    const { user, membership } = await makeMember(t.db, groupId, "member", "Being Removed");
    await t.db.membership.create({ data: { groupId: other.id, userId: user.id, role: "viewer" } });
    const cookie = await cookieFor(user.id);
    expect((await meWith(cookie)).status).toBe(200);
    await removeMember(await resolveMember(sessionOf(leadId, groupId), "members:manage"), membership.id);
    expect((await meWith(cookie)).status).toBe(401);
  });

  it("a lead, and only a lead, lifts the sign-in delay on a member's account", async () => {
    const { user, membership } = await makeMember(t.db, groupId, "member", "Guessed At");
    const at = new Date();
    for (let i = 0; i < FREE_FAILURES_PER_ACCOUNT; i++) await settleSignInAttempt(t.db, await reserveSignInAttempt(t.db, user.email, `192.0.2.${i}`, at), false);
    await expect(reserveSignInAttempt(t.db, user.email, "203.0.113.5", at)).rejects.toThrow(/Too many failed sign-ins/);
    const asMember = await resolveMember(sessionOf(user.id, groupId), "data:read");
    await expect(liftMemberSignInDelay(asMember, membership.id)).rejects.toBeInstanceOf(ForbiddenError);
    expect(await liftMemberSignInDelay(await resolveMember(sessionOf(leadId, groupId), "members:manage"), membership.id)).toBe(2 * FREE_FAILURES_PER_ACCOUNT); // a pair row and an account row per failure
    await expect(reserveSignInAttempt(t.db, user.email, "203.0.113.5", at)).resolves.toBeDefined();
    expect(await t.db.signInAttempt.count({ where: { account: attemptKeys(user.email, "").account, succeeded: false } })).toBe(2);
    expect(await t.db.auditEvent.count({ where: { groupId, action: "member.sign_in_delay_lifted", entityId: membership.id } })).toBe(1);
  });
});

describeWithAppDatabase("API tokens: expiry, and the API only", (t) => {
  let groupId = "";
  let userId = "";
  beforeAll(async () => {
    groupId = (await makeGroup(t.db, "Token Lab")).id;
    userId = (await makeMember(t.db, groupId, "member", "Token Holder")).user.id;
  });

  it("an expired token is refused with a message saying so; one within its lifetime works", async () => {
    const member = await resolveMember(sessionOf(userId, groupId), "tokens:manage");
    const fresh = await createApiToken(member, "thirty days", tokenExpiry("30"));
    expect((await callRoute(me.GET, "GET", "/api/v1/me", { token: fresh.token })).status).toBe(200);
    const old = await createApiToken(member, "expired", new Date(Date.now() - 1000));
    const refused = await callRoute(me.GET, "GET", "/api/v1/me", { token: old.token });
    expect(refused.status).toBe(401);
    expect(((await refused.json()) as ErrorJson).error.message).toMatch(/^This API token has expired\./);
    expect(tokenExpiry("never")).toBeNull();
    expect(tokenExpiry("7", new Date("2026-12-01T00:00:00Z"))?.toISOString()).toBe("2026-12-08T00:00:00.000Z");
  });

  it("a token opens no page (403, not 500) and no server action", async () => {
    // Next reads experimental.authInterrupts (next.config.mjs) into this variable at build; forbidden() needs it.
    process.env["__NEXT_EXPERIMENTAL_AUTH_INTERRUPTS"] = "true";
    const token = await tokenFor(t.db, groupId, userId);
    const page = await callRoute(
      async () => {
        try {
          await requirePageMember("tokens:manage", { returnTo: "/settings/api-tokens" });
          return new Response("rendered", { status: 200 });
        } catch (error) {
          return new Response(String((error as { digest?: string }).digest), { status: 599 });
        }
      },
      "GET", "/settings/api-tokens", { token },
    );
    expect(await page.text()).toBe("NEXT_HTTP_ERROR_FALLBACK;403");
    let ran = false;
    const action = await callRoute(
      async () => Response.json(await memberAction("data:read", () => { ran = true; return Promise.resolve("ran"); })),
      "POST", "/workups", { token },
    );
    expect(await action.json()).toMatchObject({ ok: false, status: 403 });
    expect(ran).toBe(false);
  });
});
