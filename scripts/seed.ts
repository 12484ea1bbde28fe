// npm run seed: loads the invented demo scenario into the configured database. Refuses a database that already
// holds groups, so it never mixes demo records into real ones.
import { describeDatabase, openConfiguredDb } from "@/lib/db/client";
import { isEmpty, seedDemo } from "@/seed/load";
import { DEMO_PASSWORD, demoGroup } from "@/seed/scenario";

let exitCode = 0;
try {
  const { db, close } = await openConfiguredDb();
  try {
    if (!(await isEmpty(db))) {
      console.error(`The ${describeDatabase()} already holds groups; the demo is only loaded into an empty database.`);
      exitCode = 1;
    } else {
      const s = await seedDemo(db);
      console.log(`Demo loaded into the ${describeDatabase()}: ${s.groups} groups, ${s.people} people, ${s.compounds} compounds, ${s.workups} workups.`);
      console.log(`Sign in as ${demoGroup.people[0].email} / ${DEMO_PASSWORD}`);
    }
  } finally {
    await close();
  }
} catch (e) {
  console.error(e instanceof Error ? e.message : e);
  exitCode = 1;
}
process.exit(exitCode);
