// Runs once when a Next.js server instance starts: starts the background job worker (re-validation of workups when
// the group's data changes, inference of partition values from outcomes) in this process. Several instances on one
// PostgreSQL share the queue safely (lib/jobs/queue.ts); an embedded database has one process, which runs it.
// It also leaves a shutdown hook on globalThis for the server entry (scripts/serve.mjs): on SIGTERM/SIGINT the entry
// drains the requests, then calls it to stop the worker and close the database (PGlite marks a clean shutdown only
// when closed, otherwise the next start runs crash recovery; the pool's connections are ended).

export async function register(): Promise<void> {
  // NEXT_RUNTIME and NEXT_PHASE are markers Next.js itself sets (edge vs Node, and the build's prerendering
  // workers), not configuration, so they are read here rather than through lib/env.ts.
  // eslint-disable-next-line no-restricted-properties
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  // eslint-disable-next-line no-restricted-properties
  if (process.env.NEXT_PHASE === "phase-production-build") return;
  const { startAppWorker, stopAppWorker } = await import("./lib/jobs/app-worker");
  const { closeDb } = await import("./lib/db/client");
  startAppWorker();
  (globalThis as typeof globalThis & { __layerwiseShutdown?: () => Promise<void> }).__layerwiseShutdown = async () => {
    await stopAppWorker();
    await closeDb();
  };
}
