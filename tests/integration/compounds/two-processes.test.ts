// Two real Node processes, each an app instance with its own in-memory search index, over one PostgreSQL database:
// a compound registered (or deleted) through one is found (or gone) on the next search through the other.
// Needs PostgreSQL (TEST_DATABASE_URL or DATABASE_URL): PGlite allows one process per data directory, so there is no
// two-instance deployment to test on it.
import { spawn, type ChildProcessWithoutNullStreams } from "node:child_process";
import path from "node:path";
import readline from "node:readline";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { type CompoundActor } from "@/lib/compounds/service";
import { createTestDatabase, testBackends, type TestDatabase } from "@/tests/integration/helpers/databases";
import { makeActor } from "./fixtures";

const root = path.resolve(import.meta.dirname, "../../..");
const hasPostgres = testBackends().includes("postgresql");

interface Reply {
  id?: number;
  ok?: boolean;
  ready?: boolean;
  pid?: number;
  result?: unknown;
  error?: string;
  indexed?: number;
}

class Instance {
  private readonly waiting = new Map<number, (reply: Reply) => void>();
  private next = 1;
  readonly ready: Promise<Reply>;
  private readonly child: ChildProcessWithoutNullStreams;

  constructor(url: string) {
    this.child = spawn(path.join(root, "node_modules/.bin/tsx"), [path.join(root, "tests/integration/compounds/search-instance.ts"), url], { cwd: root });
    let stderr = "";
    this.child.stderr.on("data", (chunk: Buffer) => (stderr += chunk.toString()));
    this.ready = new Promise((resolve, reject) => {
      this.child.once("exit", (code) => reject(new Error(`instance exited with ${String(code)}: ${stderr}`)));
      readline.createInterface({ input: this.child.stdout }).on("line", (line) => {
        const reply = JSON.parse(line) as Reply;
        if (reply.ready) resolve(reply);
        else if (reply.id !== undefined) this.waiting.get(reply.id)?.(reply);
      });
    });
  }

  async send(command: { op: string; actor: CompoundActor; input?: unknown; compoundId?: string }): Promise<Reply> {
    await this.ready;
    const id = this.next++;
    const reply = new Promise<Reply>((resolve) => this.waiting.set(id, resolve));
    this.child.stdin.write(`${JSON.stringify({ id, ...command })}\n`);
    const answer = await reply;
    if (!answer.ok) throw new Error(`instance failed: ${answer.error ?? "?"}`);
    return answer;
  }

  async stop(): Promise<void> {
    if (this.child.exitCode !== null) return;
    const exited = new Promise((resolve) => this.child.once("exit", resolve));
    this.child.stdin.end(`${JSON.stringify({ op: "quit" })}\n`);
    const timer = setTimeout(() => this.child.kill(), 10_000);
    await exited;
    clearTimeout(timer);
  }
}

const similar = (query: string) => ({ mode: "similarity", query, threshold: 0.99, topK: 10 });
const hitIds = (reply: Reply) => (reply.result as { ids: { id: string }[] }).ids.map((h) => h.id);
const createdIds = (reply: Reply) => (reply.result as { created: { id: string }[] }).created.map((c) => c.id);

describe.skipIf(!hasPostgres)("search across two server processes [postgresql]", () => {
  let database: TestDatabase;
  let one: Instance;
  let two: Instance;
  let actor: CompoundActor;

  beforeAll(async () => {
    database = await createTestDatabase("postgresql");
    actor = await makeActor(database.db);
    one = new Instance(database.url);
    two = new Instance(database.url);
    const [a, b] = await Promise.all([one.ready, two.ready]);
    expect(a.pid).not.toBe(b.pid);
  }, 120_000);

  afterAll(async () => {
    await Promise.all([one?.stop(), two?.stop()]);
    await database?.dispose();
  });

  it("a compound registered through one process is found by the next search on the other, and a deletion is seen too", async () => {
    const register = (via: Instance, text: string) => via.send({ op: "register", actor, input: { format: "smiles", text } });
    await register(one, "CCOC(=O)c1ccccc1 ethyl benzoate");
    // Both processes load the group into their own index before the next registration.
    expect(hitIds(await one.send({ op: "search", actor, input: similar("CCCOC(=O)c1ccccc1") }))).toEqual([]);
    expect(hitIds(await two.send({ op: "search", actor, input: similar("CCCOC(=O)c1ccccc1") }))).toEqual([]);

    const [propyl] = createdIds(await register(one, "CCCOC(=O)c1ccccc1 propyl benzoate"));
    expect(hitIds(await two.send({ op: "search", actor, input: similar("CCCOC(=O)c1ccccc1") }))).toEqual([propyl]);

    const [butyl] = createdIds(await register(two, "CCCCOC(=O)c1ccccc1 butyl benzoate"));
    expect(hitIds(await one.send({ op: "search", actor, input: similar("CCCCOC(=O)c1ccccc1") }))).toEqual([butyl]);

    await one.send({ op: "delete", actor, compoundId: propyl });
    const after = await two.send({ op: "search", actor, input: similar("CCCOC(=O)c1ccccc1") });
    expect(hitIds(after)).toEqual([]);
    expect(after.indexed).toBe(2);
  }, 120_000);
});

describe.skipIf(hasPostgres)("search across two server processes", () => {
  it.skip("needs PostgreSQL: set TEST_DATABASE_URL (or DATABASE_URL); PGlite allows only one process per data directory", () => undefined);
});
