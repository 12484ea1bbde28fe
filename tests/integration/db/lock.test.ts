// Only one process may open an embedded data dir (PGlite is single-user PostgreSQL); the lock is per data dir.
import { spawn } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { afterEach, describe, expect, it } from "vitest";
import { closeDb, createDb, getDb, type Database } from "@/lib/db/client";
import { DataDirInUseError, LOCK_FILE_NAME } from "@/lib/db/lock";
import { resetEnv } from "@/lib/env";
import { tempDir } from "../helpers/databases";

const root = path.resolve(import.meta.dirname, "../../..");
const tsxLoader = pathToFileURL(path.join(root, "node_modules/tsx/dist/loader.mjs")).href; // the child may run in a temp cwd

interface Child {
  pid: number;
  /** Resolves with "ready" once the child holds the database, or with its exit code and stderr. */
  outcome: Promise<{ ready: true } | { ready: false; code: number | null; stderr: string }>;
  exited: Promise<void>;
  stop: () => void;
}

/** A separate node process opening `dataDir` (relative paths resolve against `cwd`) through lib/db. */
function openInChild(dataDir: string, cwd: string, slug?: string): Child {
  const child = spawn(
    process.execPath,
    ["--import", tsxLoader, path.join(root, "tests/integration/helpers/open-data-dir.ts"), dataDir, ...(slug ? [slug] : [])],
    { cwd, env: { ...process.env, TSX_TSCONFIG_PATH: path.join(root, "tsconfig.json") } },
  );
  let stderr = "";
  child.stderr.on("data", (d: Buffer) => (stderr += d.toString()));
  const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
  const outcome = new Promise<{ ready: true } | { ready: false; code: number | null; stderr: string }>((resolve) => {
    child.stdout.on("data", (d: Buffer) => {
      if (d.toString().startsWith("ready")) resolve({ ready: true });
    });
    child.once("exit", (code) => resolve({ ready: false, code, stderr }));
  });
  return { pid: child.pid!, outcome, exited, stop: () => child.kill("SIGKILL") };
}

const opened: Database[] = [];
afterEach(async () => {
  for (const database of opened.splice(0)) await database.close();
});
async function open(dir: string): Promise<Database> {
  const database = await createDb({ url: `pglite:${dir}` });
  opened.push(database);
  return database;
}

describe("embedded data dir lock", () => {
  it("tells a second process which process holds the data dir and what to do", async () => {
    const work = tempDir("lw-lock");
    await open(path.join(work, "data", "pglite"));

    const result = await openInChild("data/pglite", work).outcome;
    expect(result).toEqual({
      ready: false,
      code: 3,
      stderr:
        `The embedded database at ./data/pglite is already in use by process ${process.pid}. ` +
        "Stop that process or set LAYERWISE_DATA_DIR to another folder (or DATABASE_URL to use PostgreSQL).\n",
    });
  });

  it("refuses a second open in the same process, and allows it again after close", async () => {
    const dir = path.join(tempDir("lw-lock"), "db");
    const first = await open(dir);
    const second = createDb({ url: `pglite:${dir}` });
    await expect(second).rejects.toThrow(DataDirInUseError);
    await expect(second).rejects.toThrow(`already in use by this process (${process.pid})`);

    await first.close();
    opened.splice(opened.indexOf(first), 1);
    expect(fs.existsSync(path.join(dir, LOCK_FILE_NAME))).toBe(false);
    await open(dir);
    expect(fs.readFileSync(path.join(dir, LOCK_FILE_NAME), "utf8")).toBe(`${process.pid}\n`);
  });

  it("sees through another spelling of the same folder", async () => {
    const dir = path.join(tempDir("lw-lock"), "db");
    await open(dir);
    await expect(createDb({ url: `pglite:${path.relative(process.cwd(), dir)}` })).rejects.toThrow(DataDirInUseError);
    await expect(createDb({ url: `pglite:${dir}/./` })).rejects.toThrow(DataDirInUseError);
  });

  it("takes over a lock whose pid now belongs to a process that cannot have written it", async () => {
    const dir = path.join(tempDir("lw-lock"), "db");
    fs.mkdirSync(dir);
    const lock = path.join(dir, LOCK_FILE_NAME);
    // Our own pid, but not held by us: left by an earlier process with the same pid (container restart).
    fs.writeFileSync(lock, `${process.pid}\n`);
    const first = await open(dir);
    await first.close();
    opened.splice(opened.indexOf(first), 1);

    // A live process that started long after the lock was written (a pid reused after a reboot).
    fs.writeFileSync(lock, `${process.ppid}\n`);
    const written = new Date("2001-01-01T00:00:00Z");
    fs.utimesSync(lock, written, written);
    await open(dir);
    expect(fs.readFileSync(lock, "utf8")).toBe(`${process.pid}\n`);
  });

  it("takes over the lock of a killed process, keeping what it had committed", async () => {
    const dir = path.join(tempDir("lw-lock"), "db");
    const child = openInChild(dir, root, "written-before-kill");
    expect(await child.outcome).toEqual({ ready: true });

    const refused = createDb({ url: `pglite:${dir}` });
    await expect(refused).rejects.toThrow(`already in use by process ${child.pid}.`);

    child.stop();
    await child.exited;
    const { db } = await open(dir);
    expect(await db.group.findUnique({ where: { slug: "written-before-kill" } })).toMatchObject({ name: "Held by a child process" });
  });
});

describe("getDb", () => {
  const saved = { ...process.env };
  afterEach(async () => {
    await closeDb();
    process.env = { ...saved };
    resetEnv();
  });

  it("opens the configured data dir once per process and closeDb releases it", async () => {
    const dir = path.join(tempDir("lw-getdb"), "pglite");
    delete process.env["DATABASE_URL"];
    process.env["LAYERWISE_DATA_DIR"] = dir;
    resetEnv();

    const [a, b] = await Promise.all([getDb(), getDb()]);
    expect(a).toBe(b);
    expect(await getDb()).toBe(a);
    expect(fs.readFileSync(path.join(dir, LOCK_FILE_NAME), "utf8")).toBe(`${process.pid}\n`);
    expect(await a.group.count()).toBe(0); // migrated on open

    await closeDb();
    expect(fs.existsSync(path.join(dir, LOCK_FILE_NAME))).toBe(false);
  });
});
