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
  const file = path.join(dataDir, LOCK_FILE_NAME);
  for (let attempt = 0; attempt < 5; attempt++) {
    if (tryCreate(file)) {
      let held = true;
      const release = () => {
        if (!held) return;
        held = false;
        process.off("exit", release);
        if (readOwner(file) === process.pid) fs.rmSync(file, { force: true });
      };
      process.on("exit", release);
      return release;
    }
    const owner = readOwner(file);
    if (owner !== undefined && isAlive(owner)) throw new DataDirInUseError(dataDir, owner);
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
