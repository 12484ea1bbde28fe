// Run by `npm start` before the server opens the database: applies pending migrations and, on the first start of an
// empty database (embedded by default; LAYERWISE_SEED_ON_EMPTY=true for PostgreSQL), loads the demo scenario.
import { describeDatabase, openConfiguredDb } from "@/lib/db/client";
import { env } from "@/lib/env";
import { isEmpty, seedDemo } from "@/seed/load";
import { DEMO_PASSWORD, demoGroup } from "@/seed/scenario";

let exitCode = 0;
try {
  console.log(`Layerwise: ${describeDatabase()}`);
  const { db, close } = await openConfiguredDb({ log: (line) => console.log(`  ${line}`) });
  try {
    if (env().seedOnEmpty && (await isEmpty(db))) {
      console.log("  empty database: loading the demo group (about a minute)...");
      const s = await seedDemo(db);
      console.log(`  demo loaded: ${s.groups} groups, ${s.people} people, ${s.compounds} compounds, ${s.workups} workups`);
    }
  } finally {
    await close();
  }
  const port = env().port;
  console.log(`\nLayerwise is starting on http://localhost:${port}`);
  console.log(`Demo sign-in: ${demoGroup.people[0].email} / ${DEMO_PASSWORD} (group lead)`);
  console.log(`  also ${demoGroup.people[1].email} (member) and ${demoGroup.people[4].email} (viewer), same password\n`);
} catch (e) {
  console.error(e instanceof Error ? e.message : e);
  exitCode = 1;
}
// Closing PGlite resets process.exitCode (emscripten exit), so exit explicitly.
process.exit(exitCode);
