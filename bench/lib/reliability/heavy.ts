// Heavy requests beside the authorization matrix and the malformed requests, to test that no request holds the
// server's event loop: a prediction with as many Monte Carlo draws as the engine budget allows, an SD file of 1,000
// structures, and a group import of a 200-workup export, each sent again and again by its own person (outside group
// A, so the matrix's and the fuzz's checks of group A are not touched). A prober asks a trivial route every 50 ms
// and notes how long each answer took. The server's own measurement comes from loop-probe.mjs.
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import { newApiToken } from "@/lib/authz/api-token-format";
import { loadRDKit, usingMol } from "@/lib/chem/structure";
import { type Db } from "@/lib/db/client";
import { engineCost, MAX_ENGINE_UNITS } from "@/lib/workers/cost";
import { exampleSpec } from "./fixtures";
import { ask, bearer, jsonHeaders } from "./http";

export interface HeavyPeople {
  /** A lead of group B who sends the predictions and the SD files. */
  sender: string;
  /** Leads of empty groups, one group import each. */
  importers: string[];
}

const unique = () => randomBytes(4).toString("hex");

async function tokenFor(db: Db, groupId: string, userId: string): Promise<string> {
  const { token, tokenHash, prefix } = newApiToken();
  await db.apiToken.create({ data: { groupId, userId, name: `heavy ${unique()}`, prefix, tokenHash } });
  return token;
}

/** Written through the data layer before the server opens the database. */
export async function makeHeavyPeople(db: Db, groupB: string, importGroups: number): Promise<HeavyPeople> {
  const person = async (groupId: string, name: string) => {
    const user = await db.user.create({ data: { name: `${name} ${unique()}`, email: `${name.toLowerCase().replace(/\W+/g, ".")}.${unique()}@example.org` } });
    await db.membership.create({ data: { groupId, userId: user.id, role: "lead" } });
    return tokenFor(db, groupId, user.id);
  };
  const sender = await person(groupB, "Tobias Heavyload");
  const importers: string[] = [];
  for (let i = 0; i < importGroups; i++) {
    const group = await db.group.create({ data: { name: `Import target ${i + 1}`, slug: `import-target-${unique()}` } });
    importers.push(await person(group.id, `Ulla Importer ${i + 1}`));
  }
  return { sender, importers };
}

export interface HeavyPayloads {
  predict: string;
  draws: number;
  sdf: string;
  sdfRecords: number;
  importDoc: string;
  importWorkups: number;
}

/** Distinct real molecules: ring systems with a straight alkyl chain of 1 to 100 carbons. */
async function sdFile(records: number): Promise<string> {
  const rdkit = await loadRDKit();
  const heads = ["c1ccccc1", "Oc1ccc(cc1)", "Nc1ccc(cc1)", "OC(=O)c1ccc(cc1)", "C1CCN(CC1)", "c1ccncc1", "OC(=O)", "NC", "OC", "Clc1ccc(cc1)"];
  const smiles = heads.flatMap((h) => Array.from({ length: 100 }, (_, i) => `${h}${"C".repeat(i + 1)}`)).slice(0, records);
  return smiles.map((s, i) => {
    const block = usingMol(rdkit.get_mol(s)!, (m) => m.get_molblock()).split("\n");
    block[0] = `Heavy series ${i + 1}`;
    return `${block.join("\n").replace(/\n*$/, "\n")}$$$$\n`;
  }).join("");
}

/** The bodies, built once: the export is group B's, its workups copied under new refs. */
export async function makeHeavyPayloads(base: string, root: string, senderToken: string, workups = 200, records = 1000): Promise<HeavyPayloads> {
  const spec = exampleSpec(root);
  const perDraw = engineCost(spec, 0).units;
  // As many draws as the engine budget allows, within the schema's 2,000.
  const draws = Math.min(2000, Math.floor(MAX_ENGINE_UNITS / perDraw) - 1);
  const exported = await ask(base, "/api/v1/group/export", { headers: bearer(senderToken), timeoutMs: 120_000 });
  if (exported.status !== 200) throw new Error(`group export: ${exported.status} ${exported.body.slice(0, 200)}`);
  const doc = JSON.parse(exported.body) as { workups: { ref: string }[]; compounds: unknown[]; observations: unknown[] };
  const first = doc.workups[0];
  if (!first) throw new Error("group export: no workup to copy");
  doc.workups = Array.from({ length: workups }, (_, i) => ({ ...structuredClone(first), ref: `${first.ref}-${i}` }));
  return { predict: JSON.stringify({ spec, draws }), draws, sdf: await sdFile(records), sdfRecords: records, importDoc: JSON.stringify(doc), importWorkups: workups };
}

export interface HeavyRecord {
  kind: "predict" | "sdf" | "import";
  at: number;
  ms: number;
  status: number;
}

export interface ProbeRecord {
  at: number;
  ms: number;
  status: number;
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Starts the heavy senders and the prober; `stop` ends them and returns what they saw. */
export function startHeavyLoad(base: string, people: HeavyPeople, payloads: HeavyPayloads, nextImporter: { i: number }) {
  let stopped = false;
  const heavy: HeavyRecord[] = [];
  const probes: ProbeRecord[] = [];
  const note = (kind: HeavyRecord["kind"], at: number, a: { status: number; ms: number }) => heavy.push({ kind, at, ms: Math.round(a.ms), status: a.status });
  const loop = async (kind: HeavyRecord["kind"], pause: number, send: () => Promise<{ status: number; ms: number } | null>) => {
    while (!stopped) {
      const at = Date.now();
      const a = await send();
      if (!a) return;
      note(kind, at, a);
      await sleep(pause);
    }
  };
  const running = Promise.all([
    loop("predict", 500, () => ask(base, "/api/v1/predict", { method: "POST", headers: jsonHeaders(people.sender), body: payloads.predict, timeoutMs: 120_000 })),
    loop("sdf", 1000, () => ask(base, "/api/v1/compounds", {
      method: "POST", headers: jsonHeaders(people.sender), timeoutMs: 300_000,
      body: JSON.stringify({ format: "sdf", text: payloads.sdf, onDuplicate: "skip" }),
    })),
    loop("import", 5000, async () => {
      const token = people.importers[nextImporter.i++];
      if (!token) return null; // every empty group has had its import
      return ask(base, "/api/v1/group/import", { method: "POST", headers: jsonHeaders(token), body: payloads.importDoc, timeoutMs: 300_000 });
    }),
    (async () => {
      while (!stopped) {
        const at = Date.now();
        const a = await ask(base, "/api/v1/me", { timeoutMs: 60_000 });
        probes.push({ at, ms: Math.round(a.ms), status: a.status });
        await sleep(50);
      }
    })(),
  ]);
  return {
    async stop(): Promise<{ heavy: HeavyRecord[]; probes: ProbeRecord[] }> {
      stopped = true;
      await running;
      return { heavy, probes };
    },
  };
}

export interface LoopLine {
  at: number;
  kind: "turn" | "second";
  ms?: number;
  activeMs?: number;
  inFlight?: string[];
  max?: number;
  p99?: number;
}

export function readLoopFile(file: string): LoopLine[] {
  if (!fs.existsSync(file)) return [];
  return fs.readFileSync(file, "utf8").split("\n").filter(Boolean).map((l) => JSON.parse(l) as LoopLine);
}

const quantile = (values: number[], q: number) => {
  if (values.length === 0) return 0;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] ?? 0;
};

export interface PhaseLoopReport {
  phase: string;
  seconds: number;
  /**
   * Longest time the server's loop was busy running code between two ticks of a 20 ms timer, ms: what a request (or
   * several in a row) held it for. The target is under 1 s.
   */
  maxLoopHeldMs: number;
  /** Such holds over 1 s, and over 250 ms. */
  heldOver1s: number;
  heldOver250ms: number;
  /**
   * Largest event-loop delay in wall time (perf_hooks histogram and the timer's lateness), ms: the hold above plus the
   * time the OS did not run the thread (on a shared machine short of CPU, seconds at times).
   */
  maxLoopDelayMs: number;
  /** Requests open during holds over 1 s (the prober's GET /api/v1/me left out), with how many such holds each. */
  openDuringLongHolds: Record<string, number>;
  probe: { requests: number; maxMs: number; p99Ms: number; medianMs: number };
  heavy: Record<string, { requests: number; statuses: Record<string, number>; medianMs: number; maxMs: number }>;
}

export function phaseReport(phase: string, from: number, to: number, loop: LoopLine[], seen: { heavy: HeavyRecord[]; probes: ProbeRecord[] }): PhaseLoopReport {
  const inside = loop.filter((l) => l.at >= from && l.at <= to + 1500);
  const turns = inside.filter((l) => l.kind === "turn").map((l) => l.ms ?? 0);
  const held = inside.filter((l) => l.kind === "turn").map((l) => l.activeMs ?? 0);
  const seconds = inside.filter((l) => l.kind === "second").map((l) => l.max ?? 0);
  const heavy: PhaseLoopReport["heavy"] = {};
  for (const kind of ["predict", "sdf", "import"]) {
    const mine = seen.heavy.filter((h) => h.kind === kind);
    const statuses: Record<string, number> = {};
    for (const h of mine) statuses[h.status] = (statuses[h.status] ?? 0) + 1;
    heavy[kind] = { requests: mine.length, statuses, medianMs: quantile(mine.map((h) => h.ms), 0.5), maxMs: Math.max(0, ...mine.map((h) => h.ms)) };
  }
  const probeMs = seen.probes.map((p) => p.ms);
  return {
    phase, seconds: Math.round((to - from) / 1000),
    maxLoopHeldMs: Math.max(0, ...held),
    heldOver1s: held.filter((t) => t > 1000).length,
    heldOver250ms: held.filter((t) => t > 250).length,
    maxLoopDelayMs: Math.max(0, ...seconds, ...turns),
    openDuringLongHolds: inside.filter((l) => l.kind === "turn" && (l.activeMs ?? 0) > 1000).flatMap((l) => l.inFlight ?? [])
      .filter((r) => r !== "GET /api/v1/me").reduce<Record<string, number>>((m, r) => ({ ...m, [r]: (m[r] ?? 0) + 1 }), {}),
    probe: { requests: probeMs.length, maxMs: Math.max(0, ...probeMs), p99Ms: quantile(probeMs, 0.99), medianMs: quantile(probeMs, 0.5) },
    heavy,
  };
}
