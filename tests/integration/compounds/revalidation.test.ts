// A compound edit changes what the engine predicts for every workup using the compound, so the edit queues a
// re-validation job in its own transaction; an edit that is refused queues nothing.
import { beforeAll, expect, it } from "vitest";
import { ConflictError } from "@/lib/errors";
import { clearLogP, revertPKa, setLogP, setPKa } from "@/lib/compounds/edits";
import { getCompound } from "@/lib/compounds/queries";
import { registerCompounds, type CompoundActor } from "@/lib/compounds/service";
import { readRevalidationPayload } from "@/lib/jobs/revalidate";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { makeActor } from "./fixtures";

describeEachDatabase("compound edits queue re-validation", (t) => {
  let actor: CompoundActor;
  let phenolId: string;
  const jobs = () => t.db.job.findMany({ where: { groupId: actor.groupId, kind: "revalidate" }, select: { status: true, payload: true } });

  beforeAll(async () => {
    actor = await makeActor(t.db, "Revalidation lab");
    const { created } = await registerCompounds(t.db, actor, { format: "smiles", text: "Oc1ccccc1 phenol", tags: [], onDuplicate: "reject" });
    phenolId = created[0]!.id;
  });

  it("queues nothing for a refused edit and one job for an accepted log P", async () => {
    // Phenol log Kow 1.46 (Hansch, Leo & Hoekman, Exploring QSAR: Hydrophobic, Electronic and Steric Constants, 1995).
    const stale = setLogP(t.db, actor, { compoundId: phenolId, value: 1.46, provenance: "literature", source: "Hansch 1995", expected: 0.5 });
    await expect(stale).rejects.toBeInstanceOf(ConflictError);
    expect(await jobs()).toHaveLength(0);

    await setLogP(t.db, actor, { compoundId: phenolId, value: 1.46, provenance: "literature", source: "Hansch 1995", expected: null });
    const queued = await jobs();
    expect(queued).toHaveLength(1);
    expect(queued[0]!.status).toBe("queued");
    const payload = readRevalidationPayload(queued[0]!.payload as Record<string, unknown>);
    expect(payload.compoundIds).toEqual([phenolId]);
    expect(payload.reasons).toHaveLength(1);
    expect(payload.reasons[0]).toContain("log P set to 1.46");
  });

  it("merges later pKa and clear edits into the job still waiting, and a refused one adds no reason", async () => {
    await expect(clearLogP(t.db, actor, phenolId, 2)).rejects.toBeInstanceOf(ConflictError);
    const site = (await getCompound(t.db, actor.groupId, phenolId)).pKas[0]!;
    // Phenol pKa 9.99 at 25 °C (CRC Handbook of Chemistry and Physics, dissociation constants of organic acids).
    await setPKa(t.db, actor, { compoundId: phenolId, index: 0, value: 9.99, kind: "acid", provenance: "literature", source: "CRC Handbook", expected: site.value });
    await revertPKa(t.db, actor, phenolId, 0, 9.99);
    await clearLogP(t.db, actor, phenolId, 1.46);
    const queued = await jobs();
    expect(queued).toHaveLength(1);
    const payload = readRevalidationPayload(queued[0]!.payload as Record<string, unknown>);
    expect(payload.compoundIds).toEqual([phenolId]);
    expect(payload.reasons).toHaveLength(4);
    expect(payload.reasons.slice(1).join(" | ")).toMatch(/pKa .* set to 9\.99 \| pKa .* reverted \| log P cleared/);
  });
});
