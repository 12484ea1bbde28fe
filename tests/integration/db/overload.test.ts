// Overload is answered 503 with Retry-After and writes nothing: an interactive transaction that cannot start within
// its maxWait (Prisma P2028, the error that answered 500 under load before) and, on PostgreSQL, a query that finds
// no free pooled connection within the wait, both on real databases with the limits shrunk to provoke them.
import "@/tests/integration/api/next-runtime";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createDb, DB_LIMITS, type Database } from "@/lib/db/client";
import { isOverloadError } from "@/lib/db/errors";
import { actionFailure, errorResponse, type ErrorBody } from "@/lib/errors";
import { createTestDatabase, testBackends, type TestDatabase } from "@/tests/integration/helpers/databases";

const hold = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

async function expect503(error: unknown): Promise<void> {
  expect(isOverloadError(error)).toBe(true);
  const response = errorResponse(error, "overload test");
  expect(response.status).toBe(503);
  expect(Number(response.headers.get("retry-after"))).toBeGreaterThan(0);
  const body = (await response.json()) as ErrorBody;
  expect(body.error).toEqual({ code: "overloaded", message: "The server is busy right now; nothing was saved. Try again in a few seconds." });
  expect(actionFailure(error, "overload test")).toMatchObject({ ok: false, status: 503, retryAfterSeconds: 5 });
}

it("the defaults bound every wait for the database to seconds, not forever", () => {
  expect(DB_LIMITS.connectionWaitMs).toBeGreaterThan(0);
  expect(DB_LIMITS.connectionWaitMs).toBeLessThanOrEqual(30_000);
  expect(DB_LIMITS.transactionMaxWaitMs).toBeLessThanOrEqual(30_000);
  expect(DB_LIMITS.transactionTimeoutMs).toBeLessThanOrEqual(60_000);
});

for (const backend of testBackends()) {
  describe(`overload [${backend}]`, () => {
    let base: TestDatabase;
    let small: Database;
    beforeAll(async () => {
      base = await createTestDatabase(backend, { onDisk: backend === "pglite" });
      if (backend === "pglite") {
        small = { db: base.db, close: () => Promise.resolve() }; // one PGlite per data dir: the same client, shorter waits per call
      } else {
        small = await createDb({ url: base.url, migrate: false, limits: { poolSize: 1, connectionWaitMs: 500, transactionMaxWaitMs: 500 } });
      }
      await small.db.group.count(); // the one pooled connection is open before anything waits for it
    });
    afterAll(async () => {
      await small?.close();
      await base?.dispose();
    });

    it("a transaction that cannot start within its maxWait is P2028, answered 503 with Retry-After; nothing of it is written", async () => {
      const slug = `overload-${backend}`;
      const holder = small.db.$transaction(async (tx) => {
        await tx.group.count();
        await hold(1500);
      }, { timeout: 10_000, maxWait: 10_000 });
      await hold(100);
      const refused = small.db.$transaction(async (tx) => {
        await tx.group.create({ data: { name: "Written under overload", slug } });
      }, { maxWait: 200 }).then(() => null, (error: unknown) => error);
      const error = await refused;
      await holder;
      expect(error).not.toBeNull();
      await expect503(error);
      expect(await base.db.group.count({ where: { slug } })).toBe(0);
    });

    if (backend === "postgresql") {
      it("a query that finds no free pooled connection within the wait is answered 503 with Retry-After", async () => {
        const holder = small.db.$transaction(async (tx) => {
          await tx.group.count();
          await hold(1500);
        }, { timeout: 10_000, maxWait: 10_000 });
        await hold(100);
        const error = await small.db.group.count().then(() => null, (e: unknown) => e);
        await holder;
        expect(error).not.toBeNull();
        await expect503(error);
      });
    }
  });
}
