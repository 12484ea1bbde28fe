/**
 * `npx tsx bench/workups-list.bench.ts`: how the workup list (lib/workups/queries.ts listWorkups, keyset pagination on
 * performedOn desc, id asc) holds up with 100,000 workups in one group (issue 5, item 5). Not part of the test suite.
 *
 * Seeds a fresh database on each backend with multi-row INSERT … SELECT generate_series (100,000 workups with 3
 * components and a stored prediction each, plus 10,000 in a second group), runs ANALYZE, then times the first page,
 * a page 50,000 rows deep (cursor), OFFSET at the same depth for contrast, and filtered first pages. Each figure is
 * the median of RUNS calls after one warm-up. Backends: in-memory PGlite always; PostgreSQL too when
 * BENCH_DATABASE_URL, TEST_DATABASE_URL or DATABASE_URL is set (a database lw_bench_<random> is created and dropped).
 * The last line printed is one JSON object with every number; it is also written to bench/results/.
 */
import { createHash, randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import pg from "pg";
import { createDb, type Db } from "../lib/db/client";
import { encodeCursor, LIST_ORDER, listWorkups } from "../lib/workups/queries";
import { median, nowMs, round } from "./lib/stats";

const WORKUPS = Number(process.env["BENCH_WORKUPS"] ?? 100_000);
const OTHER_GROUP_WORKUPS = Math.round(WORKUPS / 10);
const RUNS = Number(process.env["BENCH_RUNS"] ?? 9);
const COMPOUNDS = 200;
const DEEP = Math.min(50_000, Math.floor(WORKUPS / 2));

const adminUrl = () => process.env["BENCH_DATABASE_URL"] || process.env["TEST_DATABASE_URL"] || process.env["DATABASE_URL"] || undefined;

async function seedGroup(db: Db, slug: string, count: number, offset: number) {
  const group = await db.group.create({ data: { name: `Bench ${slug}`, slug: `${slug}-${randomBytes(3).toString("hex")}` } });
  const users = [];
  for (let i = 0; i < 4; i++) {
    const user = await db.user.create({ data: { name: `Bench chemist ${i}`, email: `${slug}.${i}.${randomBytes(3).toString("hex")}@example.org` } });
    await db.membership.create({ data: { groupId: group.id, userId: user.id, role: "member" } });
    users.push(user.id);
  }
  const g = group.id;
  await db.$executeRawUnsafe(`
    INSERT INTO "Compound" ("id","groupId","name","synonyms","tags","canonicalSmiles","formula","molarMass","updatedAt")
    SELECT 'k' || md5($1 || i), $1, 'compound ' || i, ARRAY[]::text[], ARRAY[]::text[], 'C' || repeat('C', i), 'C' || i, 100 + i, now()
    FROM generate_series(1, ${COMPOUNDS}) AS i`, g);
  const words = `ARRAY['amide','ester','amine','acid','phenol','ketone','nitrile','alcohol','sulfonamide','lactone']`;
  await db.$executeRawUnsafe(`
    INSERT INTO "Workup" ("id","groupId","title","performedOn","chemistId","notebookRef","spec","version","searchText","solventKeys",
                          "flagged","deviationPct","status","createdAt","updatedAt")
    SELECT 'w' || md5($1 || i), $1,
           'Workup ' || i || ' of the ' || (${words})[1 + i % 10],
           date '2020-01-01' + ((i * 7919) % 2500),
           (ARRAY[$2,$3,$4,$5])[1 + i % 4],
           'NB-' || (i / 50) || '/' || (i % 50),
           '{}'::jsonb, 1,
           lower('workup ' || i || ' of the ' || (${words})[1 + i % 10] || ' | nb-' || (i / 50) || '/' || (i % 50) || ' | compound ' || (1 + (i * 13) % ${COMPOUNDS})),
           ARRAY[(ARRAY['etoac','dcm','et2o','toluene','mtbe','hexane','chcl3','2-methf'])[1 + i % 8]],
           i % 23 = 0, CASE WHEN i % 3 = 0 THEN (i % 41) - 20 ELSE NULL END,
           (CASE WHEN i % 3 <> 0 THEN 'unknown' WHEN i % 23 = 0 THEN 'below' ELSE 'as_expected' END)::"OutcomeStatus",
           now(), now()
    FROM generate_series(${offset + 1}, ${offset + count}) AS i`, g, users[0], users[1], users[2], users[3]);
  await db.$executeRawUnsafe(`
    INSERT INTO "WorkupComponent" ("id","groupId","workupId","compoundId","key","name","role","amountMmol")
    SELECT 'p' || md5($1 || i || '-' || j), $1, 'w' || md5($1 || i), 'k' || md5($1 || (1 + (i * 13 + j * 71) % ${COMPOUNDS})),
           'c' || j, 'compound ' || (1 + (i * 13 + j * 71) % ${COMPOUNDS}),
           (CASE WHEN j = 0 THEN 'product' ELSE 'reagent' END)::"ComponentRole", 1 + j
    FROM generate_series(${offset + 1}, ${offset + count}) AS i, generate_series(0, 2) AS j`, g);
  await db.$executeRawUnsafe(`
    INSERT INTO "Prediction" ("id","groupId","workupId","workupVersion","engineVersion","result","productRecovery","recoveryLow","recoveryHigh")
    SELECT 'r' || md5($1 || i), $1, 'w' || md5($1 || i), 1, 'bench', '{}'::jsonb, 0.5 + (i % 50) / 100.0, 0.4 + (i % 50) / 100.0, 0.6 + (i % 40) / 100.0
    FROM generate_series(${offset + 1}, ${offset + count}) AS i`, g);
  return { groupId: g, users, compound: `k${md5Hex(g + "7")}` };
}

/** The id the seed SQL gives compound `i` of a group: 'k' || md5(groupId || i). */
function md5Hex(text: string): string {
  return createHash("md5").update(text).digest("hex");
}

async function time(run: () => Promise<unknown>): Promise<number> {
  await run();
  const times: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const t0 = nowMs();
    await run();
    times.push(nowMs() - t0);
  }
  return round(median(times), 2);
}

async function measure(db: Db, backend: string) {
  const t0 = nowMs();
  const main = await seedGroup(db, "main", WORKUPS, 0);
  await seedGroup(db, "other", OTHER_GROUP_WORKUPS, WORKUPS);
  await db.$executeRawUnsafe("ANALYZE");
  const seedSeconds = round((nowMs() - t0) / 1000, 1);
  const g = main.groupId;
  const [deepRow] = await db.workup.findMany({
    where: { groupId: g }, orderBy: LIST_ORDER, skip: DEEP - 1, take: 1, select: { performedOn: true, id: true },
  });
  const deepCursor = encodeCursor(deepRow!);
  const list = (filter: Record<string, unknown>) => () => listWorkups(db, g, filter);
  const results: Record<string, number> = {
    firstPage: await time(list({})),
    deepPageKeyset: await time(list({ cursor: deepCursor })),
    deepPageOffset: await time(() => db.workup.findMany({
      where: { groupId: g }, orderBy: LIST_ORDER, skip: DEEP, take: 26, select: { id: true, title: true },
    })),
    textCommon: await time(list({ q: "amide" })),
    textRare: await time(list({ q: "nb-1234/7" })),
    textNoMatch: await time(list({ q: "no such words" })),
    compound: await time(list({ compoundId: main.compound })),
    solvent: await time(list({ solvent: "toluene" })),
    chemist: await time(list({ chemistId: main.users[2] })),
    dateRange: await time(list({ from: "2023-03-01", to: "2023-03-31" })),
    flagged: await time(list({ flagged: true })),
    flaggedDeep: await time(list({ flagged: true, cursor: deepCursor })),
    combined: await time(list({ chemistId: main.users[1], solvent: "dcm", from: "2021-01-01", to: "2024-12-31", q: "ester" })),
  };
  const page = await listWorkups(db, g, { compoundId: main.compound });
  return { backend, workups: WORKUPS, seedSeconds, medianMs: results, compoundFilterRows: page.rows.length };
}

async function main() {
  const report: unknown[] = [];
  if (process.env["BENCH_SKIP_PGLITE"] !== "1") {
    const memory = await createDb({ url: "pglite:memory" });
    try {
      report.push(await measure(memory.db, "pglite"));
      console.log(JSON.stringify(report.at(-1)));
    } finally {
      await memory.close();
    }
  }
  const admin = adminUrl();
  if (admin) {
    const name = `lw_bench_${randomBytes(5).toString("hex")}`;
    const client = new pg.Client({ connectionString: admin });
    await client.connect();
    await client.query(`CREATE DATABASE "${name}"`);
    const url = new URL(admin);
    url.pathname = `/${name}`;
    try {
      const server = await createDb({ url: url.toString() });
      try {
        report.push(await measure(server.db, "postgresql"));
        console.log(JSON.stringify(report.at(-1)));
      } finally {
        await server.close();
      }
    } finally {
      // BENCH_KEEP=1 leaves the database for EXPLAIN ANALYZE by hand.
      if (process.env["BENCH_KEEP"] === "1") console.log(`kept database ${name}`);
      else await client.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
      await client.end();
    }
  }
  const out = path.resolve("bench/results");
  fs.mkdirSync(out, { recursive: true });
  const summary = JSON.stringify({ bench: "workups-list", at: new Date().toISOString(), runs: RUNS, results: report });
  fs.writeFileSync(path.join(out, `workups-list-${Date.now()}.json`), summary);
  console.log(summary);
}

await main();
