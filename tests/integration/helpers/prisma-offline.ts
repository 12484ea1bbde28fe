/**
 * Runs scripts/prisma-offline.mjs (Prisma's own schema engine, compiled to WebAssembly) in a child process, so tests
 * can ask Prisma itself whether a database matches schema.prisma and accepts our migration history.
 *
 *   runPrismaOffline(args, databaseUrl, options?) -> { code, stdout, stderr }
 *   EMPTY_DIFF: what `diff` prints when there is nothing to change.
 */
import { execFile } from "node:child_process";
import path from "node:path";

export const EMPTY_DIFF = "-- This is an empty migration.";

export interface ToolRun {
  code: number;
  stdout: string;
  stderr: string;
}

export function runPrismaOffline(
  args: readonly string[],
  databaseUrl: string,
  options: { migrationsDir?: string } = {},
): Promise<ToolRun> {
  const root = path.resolve(import.meta.dirname, "../../..");
  const extra = options.migrationsDir ? ["--migrations", options.migrationsDir] : [];
  return new Promise((resolve, reject) => {
    execFile(
      process.execPath,
      [path.join(root, "scripts/prisma-offline.mjs"), ...args, ...extra],
      { cwd: root, env: { ...process.env, DATABASE_URL: databaseUrl }, timeout: 120_000 },
      (error, stdout, stderr) => {
        if (!error) resolve({ code: 0, stdout, stderr });
        else if (typeof error.code === "number") resolve({ code: error.code, stdout, stderr });
        else reject(new Error(`prisma-offline.mjs ${args.join(" ")} did not finish: ${error.message}`, { cause: error }));
      },
    );
  });
}
