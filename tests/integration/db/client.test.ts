// The Prisma client from lib/db on every configured backend: round trips of each column kind, secret columns left
// out by default, named Prisma errors, and interactive transactions.
import { describe, expect, it } from "vitest";
import { createDb } from "@/lib/db/client";
import { isForeignKeyViolation, isRecordNotFound, isUniqueViolation } from "@/lib/db/errors";
import { describeEachDatabase } from "../helpers/databases";

describeEachDatabase("client", (t) => {
  const newGroup = (slug: string) => t.db.group.create({ data: { name: `Group ${slug}`, slug } });

  it("round-trips a workup with its group, JSON spec and dates", async () => {
    const group = await newGroup("roundtrip");
    const performedOn = new Date("2026-03-14T09:30:00.000Z");
    const spec = { components: [{ key: "p", amountMmol: 2.5 }], operations: [{ kind: "wash", reagent: "brine" }] };
    const created = await t.db.workup.create({ data: { groupId: group.id, title: "Amide coupling wash", performedOn, spec, scaleMmol: 2.5 } });

    const read = await t.db.workup.findUniqueOrThrow({ where: { id: created.id }, include: { group: true } });
    expect(read).toMatchObject({ title: "Amide coupling wash", spec, scaleMmol: 2.5, version: 1, status: "unknown", flagged: false });
    expect(read.performedOn.toISOString()).toBe(performedOn.toISOString());
    expect(read.group.slug).toBe("roundtrip");
  });

  // The compound values are only stored and read back: benzoic acid, M = 122.12 g/mol, logP 1.87, pKa 4.2 (from memory).
  it("round-trips text arrays, floats and bytes on a compound", async () => {
    const group = await newGroup("compound");
    const fingerprint = new Uint8Array(256).map((_, i) => (i * 37) % 256);
    const compound = await t.db.compound.create({
      data: {
        groupId: group.id, name: "benzoic acid", synonyms: ["benzenecarboxylic acid"], tags: ["acid", "aromatic"],
        canonicalSmiles: "O=C(O)c1ccccc1", formula: "C7H6O2", molarMass: 122.12, logP: 1.87,
        pKas: [{ value: 4.2, kind: "acid" }], fingerprint,
      },
    });
    const read = await t.db.compound.findUniqueOrThrow({ where: { id: compound.id } });
    expect(read.synonyms).toEqual(["benzenecarboxylic acid"]);
    expect(read.tags).toEqual(["acid", "aromatic"]);
    expect(read.molarMass).toBeCloseTo(122.12, 10);
    expect(read.pKas).toEqual([{ value: 4.2, kind: "acid" }]);
    expect(Array.from(read.fingerprint!)).toEqual(Array.from(fingerprint));
  });

  it("leaves secret columns out unless a query asks for them", async () => {
    const group = await newGroup("secrets");
    const user = await t.db.user.create({ data: { email: "secret@example.test", name: "A. Chemist", passwordHash: "$2b$12$hash" } });
    expect(user).not.toHaveProperty("passwordHash");
    expect(await t.db.user.findUniqueOrThrow({ where: { id: user.id } })).not.toHaveProperty("passwordHash");
    expect(await t.db.user.findUniqueOrThrow({ where: { id: user.id }, omit: { passwordHash: false } })).toHaveProperty("passwordHash", "$2b$12$hash");

    await t.db.membership.create({ data: { groupId: group.id, userId: user.id, role: "lead" } });
    const member = await t.db.membership.findFirstOrThrow({ where: { groupId: group.id }, include: { user: true } });
    expect(member.user).not.toHaveProperty("passwordHash");

    const token = await t.db.apiToken.create({ data: { groupId: group.id, userId: user.id, name: "ci", prefix: "lw_ab", tokenHash: "tok-hash" } });
    expect(await t.db.apiToken.findUniqueOrThrow({ where: { id: token.id } })).not.toHaveProperty("tokenHash");
    expect(await t.db.apiToken.findUnique({ where: { tokenHash: "tok-hash" }, omit: { tokenHash: false } })).toHaveProperty("tokenHash", "tok-hash");

    await t.db.$transaction(async (tx) => {
      expect(await tx.user.findUniqueOrThrow({ where: { id: user.id } })).not.toHaveProperty("passwordHash");
    });

    const invite = await t.db.invite.create({
      data: { groupId: group.id, tokenHash: "inv-hash", role: "member", createdById: user.id, expiresAt: new Date(Date.now() + 86_400_000) },
    });
    expect(await t.db.invite.findFirstOrThrow({ where: { id: invite.id } })).not.toHaveProperty("tokenHash");
  });

  it("names unique, not-found and foreign-key errors", async () => {
    await newGroup("taken");
    const duplicate = await newGroup("taken").catch((e: unknown) => e);
    expect(isUniqueViolation(duplicate)).toBe(true);
    expect(isRecordNotFound(duplicate)).toBe(false);

    const missing = await t.db.group.update({ where: { id: "no-such-group" }, data: { name: "x" } }).catch((e: unknown) => e);
    expect(isRecordNotFound(missing)).toBe(true);

    const orphan = await t.db.membership
      .create({ data: { groupId: "no-such-group", userId: "no-such-user", role: "member" } })
      .catch((e: unknown) => e);
    expect(isForeignKeyViolation(orphan)).toBe(true);
  });

  it("rolls back an interactive transaction that throws, and commits one that does not", async () => {
    const failure = new Error("invariant violated");
    await expect(
      t.db.$transaction(async (tx) => {
        await tx.group.create({ data: { name: "Half", slug: "half-written" } });
        throw failure;
      }),
    ).rejects.toBe(failure);
    expect(await t.db.group.findUnique({ where: { slug: "half-written" } })).toBeNull();

    await t.db.$transaction(async (tx) => {
      const g = await tx.group.create({ data: { name: "Whole", slug: "whole" } });
      await tx.auditEvent.create({ data: { groupId: g.id, action: "create", entity: "Group", entityId: g.id } });
    });
    expect(await t.db.auditEvent.count({ where: { group: { slug: "whole" } } })).toBe(1);
  });

  it("serves concurrent queries", async () => {
    const slugs = Array.from({ length: 12 }, (_, i) => `parallel-${i}`);
    await Promise.all(slugs.map((slug) => newGroup(slug)));
    expect(await t.db.group.count({ where: { slug: { startsWith: "parallel-" } } })).toBe(12);
  });
});

describe("createDb", () => {
  it("names the accepted URL forms when given another", async () => {
    await expect(createDb({ url: "mysql://localhost/lw" })).rejects.toThrow(
      'Unsupported database URL "mysql:…": use postgresql://…, pglite:<dir> or pglite:memory.',
    );
  });
});
