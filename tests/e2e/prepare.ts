// Run (with tsx) by the Playwright web server command before `next start`: creates a fresh embedded database,
// migrates it, and writes the test people and workups THROUGH THE DATA LAYER (lib/db), then closes it so the
// server can open the directory. Playwright starts its web server before any globalSetup, hence this script.
import fs from "node:fs";
import path from "node:path";
import { hashPassword } from "@/lib/auth/password";
import { createDb } from "@/lib/db/client";
import { GROUP_A, GROUP_B, PASSWORD, PEOPLE, WORKUP_A_TITLE, WORKUP_B_TITLE, type E2eFixtures } from "./people";

const dataDir = process.env["LAYERWISE_DATA_DIR"];
if (!dataDir?.includes(`${path.sep}.tmp${path.sep}e2e-`)) throw new Error(`Refusing to prepare ${dataDir}: not an .tmp/e2e-* folder`);

// Earlier runs' folders (the server of a finished run has exited; anything older than an hour is left over).
const parent = path.dirname(dataDir);
for (const entry of fs.existsSync(parent) ? fs.readdirSync(parent) : []) {
  const full = path.join(parent, entry);
  if (entry.startsWith("e2e-") && full !== dataDir && Date.now() - fs.statSync(full).mtimeMs > 3_600_000) fs.rmSync(full, { recursive: true, force: true });
}
fs.rmSync(dataDir, { recursive: true, force: true });

const spec = (product: string, wash: string) => ({
  components: [{ key: "product", name: product, role: "product", molarMass: 195.17, amount: { value: 5, unit: "mmol" } }],
  mixture: { solvents: [{ solvent: "ethyl_acetate", volume: { value: 30, unit: "mL" } }] },
  operations: [
    { type: "wash", reagent: wash, volume: { value: 20, unit: "mL" }, portions: 2 },
    { type: "dry", agent: "mgso4" },
    { type: "concentrate" },
  ],
});

const { db, close } = await createDb({ url: `pglite:${dataDir}` });
let exitCode = 0;
try {
  const passwordHash = await hashPassword(PASSWORD);
  const groups = {
    A: await db.group.create({ data: GROUP_A }),
    B: await db.group.create({ data: GROUP_B }),
  };
  for (const person of Object.values(PEOPLE)) {
    const user = await db.user.create({ data: { name: person.name, email: person.email, passwordHash } });
    await db.membership.create({ data: { groupId: groups[person.group].id, userId: user.id, role: person.role } });
  }
  const performedOn = new Date("2026-10-14T00:00:00Z");
  const workupA = await db.workup.create({
    data: { groupId: groups.A.id, title: WORKUP_A_TITLE, performedOn, notebookRef: "HL-0112", spec: spec("ethyl 4-nitrobenzoate", "sat_nahco3") },
  });
  const workupB = await db.workup.create({
    data: { groupId: groups.B.id, title: WORKUP_B_TITLE, performedOn, notebookRef: "KL-0047", spec: spec("4-chloroaniline", "hcl_1m") },
  });
  const fixtures: E2eFixtures = { workupA: workupA.id, workupB: workupB.id };
  fs.writeFileSync(`${dataDir}.json`, JSON.stringify(fixtures));
  console.log(`e2e database ready in ${dataDir}`);
} catch (e) {
  console.error(e);
  exitCode = 1;
} finally {
  await close();
}
// Closing PGlite resets process.exitCode (emscripten exit), so exit explicitly.
process.exit(exitCode);
