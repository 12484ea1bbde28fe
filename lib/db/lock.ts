// PGlite is PostgreSQL in single-user mode: two processes writing one data directory corrupt it. An exclusive lock
// file (<dataDir>/layerwise.lock holding the owner's pid) keeps a second process out with a clear message.
// scripts/prisma-offline.mjs honours the same file.
import fs from "node:fs";
import path from "node:path";

export const LOCK_FILE_NAME = "layerwise.lock";

export class DataDirInUseError extends Error {
  override name = "DataDirInUseError";
  constructor(
    readonly dataDir: string,
    readonly pid: number,
  ) {
    const owner = pid === process.pid ? `this process (${pid})` : `process ${pid}`;
    super(
      `The embedded database at ${displayPath(dataDir)} is already in use by ${owner}. ` +
        "Stop that process or set LAYERWISE_DATA_DIR to another folder (or DATABASE_URL to use PostgreSQL).",
    );
  }
}

/** `./data/pglite` for folders under the working directory, the absolute path otherwise. */
export function displayPath(dir: string): string {
  const rel = path.relative(process.cwd(), dir);
  return rel && !rel.startsWith("..") && !path.isAbsolute(rel) ? `./${rel}` : path.resolve(dir);
}

/** Lock files this process holds right now (a lock naming our pid that is not here was left by an earlier
 * process that had the same pid, as happens to pid 1 when a container restarts). */
const held = new Map<string, symbol>();

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === "EPERM"; // exists, owned by another user
  }
}

function readOwner(file: string): number | undefined {
  try {
    const pid = Number.parseInt(fs.readFileSync(file, "utf8"), 10);
    return Number.isInteger(pid) && pid > 0 ? pid : undefined;
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === "ENOENT") return undefined;
    throw e;
  }
}

/**
 * Whether process `pid` started after `time`, so that it cannot have written a lock dated `time` (a pid reused
 * after a reboot). Linux only, from /proc/<pid>/stat field 22 (starttime, in clock ticks since boot) and the btime
 * line of /proc/stat, with USER_HZ = 100 (proc(5)); elsewhere it answers false and the pid check alone decides.
 */
function startedAfter(pid: number, time: Date): boolean {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, "utf8");
    const startTicks = Number(stat.slice(stat.lastIndexOf(")") + 2).split(" ")[19]); // fields from 3 on
    const bootSeconds = Number(/^btime (\d+)$/m.exec(fs.readFileSync("/proc/stat", "utf8"))?.[1]);
    const startedMs = (bootSeconds + startTicks / 100) * 1000;
    return Number.isFinite(startedMs) && startedMs > time.getTime() + 2000; // tolerance for tick rounding
  } catch {
    return false;
  }
}

function isStale(file: string, owner: number | undefined): boolean {
  if (owner === undefined || !isAlive(owner)) return true;
  if (owner === process.pid) return !held.has(file);
  try {
    return startedAfter(owner, fs.statSync(file).mtime);
  } catch {
    return true; // the file vanished meanwhile: nothing left to respect
  }
}

/** Creates the lock file with its content in one step (hard link of a finished temp file), or returns false. */
function tryCreate(file: string): boolean {
  const tmp = `${file}.${process.pid}.tmp`;
  fs.writeFileSync(tmp, `${process.pid}\n`);
  try {
    fs.linkSync(tmp, file);
    return true;
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === "EEXIST") return false;
    throw e;
  } finally {
    fs.rmSync(tmp, { force: true });
  }
}

/**
 * Takes the data directory (creating it and its parents) for this process. Returns the release function, which is
 * also run on process exit. A lock left by a process that no longer exists is taken over.
 * @throws DataDirInUseError when a live process (or this one) holds it.
 */
export function lockDataDir(dataDir: string): () => void {
  fs.mkdirSync(dataDir, { recursive: true });
  const file = path.join(fs.realpathSync(dataDir), LOCK_FILE_NAME); // one key however the folder is spelled
  for (let attempt = 0; attempt < 5; attempt++) {
    if (tryCreate(file)) {
      const token = Symbol(file);
      held.set(file, token);
      const release = () => {
        if (held.get(file) !== token) return; // released already
        held.delete(file);
        process.off("exit", release);
        if (readOwner(file) === process.pid) fs.rmSync(file, { force: true });
      };
      process.on("exit", release);
      return release;
    }
    const owner = readOwner(file);
    if (!isStale(file, owner)) throw new DataDirInUseError(dataDir, owner!);
    // Stale (owner gone, or an unreadable file). Two processes starting in the same instant after a crash could both
    // get here; the rename lets only one of them remove this particular file.
    try {
      fs.renameSync(file, `${file}.stale.${process.pid}`);
      fs.rmSync(`${file}.stale.${process.pid}`, { force: true });
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== "ENOENT") throw e;
    }
  }
  throw new Error(`Could not take the lock ${file}; remove it if no Layerwise process is running.`);
}
