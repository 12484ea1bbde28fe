// Default exposure: a server reachable from other machines must not start while demo accounts keep the password
// printed by `npm start` and published in the README. Before, `npm start` served every interface with them.
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, expect, it } from "vitest";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { createDb } from "@/lib/db/client";
import { demoAccountsWithPublishedPassword, lockDemoAccounts, rotateDemoPasswords } from "@/seed/demo-accounts";
import { DEMO_PASSWORD, demoGroup } from "@/seed/scenario";

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "lw-demo-"));
const lead = demoGroup.people[0].email;
const viewer = demoGroup.people[4].email;

beforeAll(async () => {
  const { db, close } = await createDb({ url: `pglite:${dir}` });
  try {
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    await db.user.create({ data: { email: lead, name: "Demo lead", passwordHash } });
    await db.user.create({ data: { email: viewer, name: "Demo viewer", passwordHash } });
  } finally {
    await close();
  }
});
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

function prepare(host: string | undefined) {
  const env: NodeJS.ProcessEnv = { ...process.env, LAYERWISE_DATA_DIR: dir, DATABASE_URL: "", LAYERWISE_SEED_ON_EMPTY: "false", AUTH_SECRET: "demo-accounts-test-secret-0123456789", HOST: host ?? "" };
  return spawnSync(process.execPath, ["--import", "tsx", "scripts/prepare-db.ts"], { env, encoding: "utf8" });
}

it("refuses to prepare a server on 0.0.0.0 while demo accounts keep the published password, and says how to fix it", () => {
  const refused = prepare("0.0.0.0");
  expect(refused.status).toBe(3);
  expect(refused.stderr).toContain("Layerwise will not listen on 0.0.0.0 (reachable from other machines) while 2 demo account(s) keep the published demo password");
  expect(refused.stderr).toContain('"npm run demo:accounts -- rotate"');
  const local = prepare(undefined);
  expect(local.status).toBe(0);
  expect(local.stdout).toContain("Layerwise is starting on http://127.0.0.1:");
}, 120_000);

it("rotating or locking the demo accounts lets it start, and ends their sessions", async () => {
  const { db, close } = await createDb({ url: `pglite:${dir}` });
  try {
    expect(await demoAccountsWithPublishedPassword(db)).toEqual([lead, viewer].sort());
    const rotated = await rotateDemoPasswords(db);
    expect(rotated.map((r) => r.email).sort()).toEqual([lead, viewer].sort());
    const stored = await db.user.findUniqueOrThrow({ where: { email: lead }, omit: { passwordHash: false } });
    expect(await verifyPassword(rotated.find((r) => r.email === lead)!.password, stored.passwordHash)).toBe(true);
    expect(stored.sessionVersion).toBe(1);
    expect(await demoAccountsWithPublishedPassword(db)).toEqual([]);
    expect(await lockDemoAccounts(db)).toBe(2);
    expect((await db.user.findUniqueOrThrow({ where: { email: viewer }, omit: { passwordHash: false } })).passwordHash).toBeNull();
  } finally {
    await close();
  }
  expect(prepare("0.0.0.0").status).toBe(0);
}, 120_000);
