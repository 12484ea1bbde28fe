// npm run db:migrate: applies pending committed migrations to the configured database (DATABASE_URL, else the embedded
// data dir). The app does the same on start; this is for deployments that migrate as a separate step.
import { describeDatabase, openConfiguredDb } from "@/lib/db/client";

let exitCode = 0;
try {
  console.log(`Migrating the ${describeDatabase()}`);
  const { close } = await openConfiguredDb({ log: (line) => console.log(`  ${line}`) });
  await close();
  console.log("Database is up to date.");
} catch (e) {
  console.error(e instanceof Error ? e.message : e);
  exitCode = 1;
}
// Closing PGlite resets process.exitCode (emscripten exit), so exit explicitly.
process.exit(exitCode);
