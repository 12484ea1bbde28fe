// Run by `npm start` before the server opens the database: applies pending migrations and, on the first start of an
// empty database (embedded by default; LAYERWISE_SEED_ON_EMPTY=true for PostgreSQL), loads the demo scenario.
import { describeDatabase, openConfiguredDb } from "@/lib/db/client";
import { env, isLoopbackHost } from "@/lib/env";
import { demoAccountsWithPublishedPassword } from "@/seed/demo-accounts";
import { isEmpty, seedDemo } from "@/seed/load";
import { DEMO_PASSWORD, demoGroup } from "@/seed/scenario";

let exitCode = 0;
try {
  const { host, port } = env();
  console.log(`Layerwise: ${describeDatabase()}`);
  const { db, close } = await openConfiguredDb({ log: (line) => console.log(`  ${line}`) });
  let openDemo: string[] = [];
  try {
    if (env().seedOnEmpty && (await isEmpty(db))) {
      console.log("  empty database: loading the demo group (about a minute)...");
      const s = await seedDemo(db);
      console.log(`  demo loaded: ${s.groups} groups, ${s.people} people, ${s.compounds} compounds, ${s.workups} workups`);
    }
    openDemo = await demoAccountsWithPublishedPassword(db);
  } finally {
    await close();
  }
  if (!isLoopbackHost(host) && openDemo.length > 0) {
    console.error(
      `\nLayerwise will not listen on ${host} (reachable from other machines) while ${openDemo.length} demo account(s) keep the ` +
        `published demo password (${openDemo.join(", ")}).\nRotate them with "npm run demo:accounts -- rotate" or lock them with ` +
        `"npm run demo:accounts -- lock", or leave HOST unset to serve this machine only.`,
    );
    exitCode = 3;
  } else {
    console.log(`\nLayerwise is starting on http://${host.includes(":") ? `[${host}]` : host}:${port}`);
    if (openDemo.length > 0) {
      console.log(`Demo sign-in: ${demoGroup.people[0].email} / ${DEMO_PASSWORD} (group lead)`);
      console.log(`  also ${demoGroup.people[1].email} (member) and ${demoGroup.people[4].email} (viewer), same password\n`);
    }
  }
} catch (e) {
  console.error(e instanceof Error ? e.message : e);
  exitCode = 1;
}
// Closing PGlite resets process.exitCode (emscripten exit), so exit explicitly.
process.exit(exitCode);
