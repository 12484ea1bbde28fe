// Two groups with their people, written through the data layer before the server opens the database, and then each
// group's records (a workup with its outcome, a compound, an image attachment with its thumbnail) created through
// the API as that group's lead, as a client would. Group A's titles carry a marker so an answer to group B that
// shows any of them is caught.
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { encode } from "next-auth/jwt";
import { newApiToken } from "@/lib/authz/api-token-format";
import { type RoleName } from "@/lib/authz/permissions";
import { type Db } from "@/lib/db/client";
import { AUTH_SECRET } from "./server";
import { ask, bearer, jsonHeaders } from "./http";

export const SESSION_COOKIE = "next-auth.session-token";
const SESSION_MAX_AGE_SECONDS = 7 * 24 * 60 * 60;

export interface Person {
  userId: string;
  groupId: string;
  role: RoleName;
  token: string;
  /** Cookie header of a signed-in browser session. */
  cookie: string;
}

export interface GroupRecords {
  workupId: string;
  compoundId: string;
  attachmentId: string;
}

export interface People {
  marker: string;
  groupA: string;
  groupB: string;
  lead: Person;
  member: Person;
  viewer: Person;
  otherLead: Person;
  /** Tokens and a session of group A's member that must open nothing. */
  revokedToken: string;
  expiredToken: string;
  endedSessionCookie: string;
}

const unique = () => randomBytes(4).toString("hex");

async function sessionCookie(userId: string, email: string, name: string, activeGroupId: string, sv = 0): Promise<string> {
  const token = await encode({ token: { uid: userId, email, name, activeGroupId, sv }, secret: AUTH_SECRET, maxAge: SESSION_MAX_AGE_SECONDS });
  return `${SESSION_COOKIE}=${token}`;
}

async function token(db: Db, groupId: string, userId: string, extra: { revokedAt?: Date; expiresAt?: Date } = {}): Promise<string> {
  const { token: value, tokenHash, prefix } = newApiToken();
  await db.apiToken.create({ data: { groupId, userId, name: `reliability ${unique()}`, prefix, tokenHash, ...extra } });
  return value;
}

export async function makePeople(db: Db): Promise<People> {
  const marker = `MARKA${unique()}`;
  const groupA = await db.group.create({ data: { name: `Reliability ${marker}`, slug: `reliability-a-${unique()}` } });
  const groupB = await db.group.create({ data: { name: "Reliability B", slug: `reliability-b-${unique()}` } });
  const person = async (groupId: string, role: RoleName, label: string): Promise<Person> => {
    const name = `${label} ${unique()}`;
    const email = `${label.toLowerCase().replace(/\W+/g, ".")}.${unique()}@example.org`;
    const user = await db.user.create({ data: { name, email, passwordHash: null } });
    await db.membership.create({ data: { groupId, userId: user.id, role } });
    return { userId: user.id, groupId, role, token: await token(db, groupId, user.id), cookie: await sessionCookie(user.id, email, name, groupId) };
  };
  const lead = await person(groupA.id, "lead", "Ines Lead");
  const member = await person(groupA.id, "member", "Oskar Member");
  const viewer = await person(groupA.id, "viewer", "Pia Viewer");
  const otherLead = await person(groupB.id, "lead", "Rafael Otherlead");
  // A signed-out session: the member's session version was raised after this cookie was minted (version 0).
  const ended = await person(groupA.id, "member", "Sven Signedout");
  await db.user.update({ where: { id: ended.userId }, data: { sessionVersion: 1 } });
  return {
    marker, groupA: groupA.id, groupB: groupB.id, lead, member, viewer, otherLead,
    revokedToken: await token(db, groupA.id, member.userId, { revokedAt: new Date() }),
    expiredToken: await token(db, groupA.id, member.userId, { expiresAt: new Date(Date.now() - 60_000) }),
    endedSessionCookie: ended.cookie,
  };
}

export function exampleSpec(root: string): Record<string, unknown> {
  return JSON.parse(fs.readFileSync(path.join(root, "examples", "acid-base-separation.json"), "utf8")) as Record<string, unknown>;
}

export function workupBody(root: string, title: string): Record<string, unknown> {
  return { header: { title, performedOn: "2026-11-03", notebookRef: "RB-01/001", scaleMmol: 5, expectedProductMmol: 5 }, spec: exampleSpec(root) };
}

export const OUTCOME = { isolatedMassMg: 820, purityPct: 97, purityMethod: "qnmr", notes: "reliability bench" };

/** A 1×1 PNG (the smallest valid image the attachment sniffer recognises). */
export const PNG_1PX = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==", "base64");

async function must(what: string, p: Promise<{ status: number; body: string }>): Promise<Record<string, unknown>> {
  const res = await p;
  if (res.status < 200 || res.status >= 300) throw new Error(`${what}: ${res.status} ${res.body.slice(0, 300)}`);
  return res.body ? (JSON.parse(res.body) as Record<string, unknown>) : {};
}

/** One group's records, created through the API with its lead's token. */
export async function makeRecords(base: string, root: string, tokenOfLead: string, label: string): Promise<GroupRecords> {
  const workup = await must("create workup", ask(base, "/api/v1/workups", { method: "POST", headers: jsonHeaders(tokenOfLead), body: JSON.stringify(workupBody(root, `${label} benzanilide washes`)) }));
  const workupId = String(workup["id"]);
  await must("report outcome", ask(base, `/api/v1/workups/${workupId}/outcome`, { method: "POST", headers: jsonHeaders(tokenOfLead), body: JSON.stringify(OUTCOME) }));
  // Each group registers a different real molecule, so the names differ (phenacetin / paracetamol).
  const smiles = label.includes("MARKA") ? "CCOc1ccc(NC(C)=O)cc1" : "CC(=O)Nc1ccc(O)cc1";
  const registered = await must("register compound", ask(base, "/api/v1/compounds", { method: "POST", headers: jsonHeaders(tokenOfLead), body: JSON.stringify({ format: "smiles", text: `${smiles} ${label}-compound`, onDuplicate: "skip" }) }));
  const created = registered["created"] as { id: string }[] | undefined;
  const compoundId = created?.[0]?.id;
  if (!compoundId) throw new Error(`register compound: no id in ${JSON.stringify(registered).slice(0, 300)}`);
  const attachment = await must("upload attachment", ask(base, `/api/v1/workups/${workupId}/attachments?name=tlc.png`, { method: "POST", headers: { ...bearer(tokenOfLead), "content-type": "application/octet-stream" }, body: PNG_1PX }));
  const attachmentId = String(attachment["id"]);
  await must("set thumbnail", ask(base, `/api/v1/attachments/${attachmentId}/thumbnail`, { method: "PUT", headers: { ...bearer(tokenOfLead), "content-type": "image/png" }, body: PNG_1PX }));
  return { workupId, compoundId, attachmentId };
}
