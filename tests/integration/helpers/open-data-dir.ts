// Child process for the data-dir lock tests: opens an embedded data dir through lib/db, writes one group, prints
// "ready <pid>" and holds the database until stdin closes. If opening fails it prints the message and exits 3.
//   npx tsx --tsconfig <repo>/tsconfig.json tests/integration/helpers/open-data-dir.ts <dataDir> [groupSlug]
import { createDb } from "@/lib/db/client";

const [dataDir, slug = `held-${process.pid}`] = process.argv.slice(2);
try {
  const { db, close } = await createDb({ url: `pglite:${dataDir}` });
  await db.group.create({ data: { name: "Held by a child process", slug } });
  process.stdout.write(`ready ${process.pid}\n`);
  process.stdin.resume();
  process.stdin.on("end", () => {
    void close().then(() => process.exit(0));
  });
} catch (e) {
  process.stderr.write(`${e instanceof Error ? e.message : String(e)}\n`);
  process.exit(3);
}
