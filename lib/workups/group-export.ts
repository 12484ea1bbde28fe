// Builds the whole-group export document (format: export-format.ts). Rows come out in a fixed order (creation time,
// then id) so that exporting a faithful import gives the same document apart from the refs.
import { type Db } from "@/lib/db/client";
import { ENGINE_VERSION } from "@/lib/chem/version";
import { NotFoundError } from "@/lib/errors";
import { EXPORT_FORMAT, EXPORT_FORMAT_VERSION, type GroupExport } from "./export-format";

type JsonIn = GroupExport["compounds"][number]["pKas"];

const iso = (d: Date) => d.toISOString();
const byCreation = [{ createdAt: "asc" as const }, { id: "asc" as const }];

export async function exportGroup(db: Db, groupId: string): Promise<GroupExport> {
  const group = await db.group.findUnique({ where: { id: groupId }, select: { name: true } });
  if (!group) throw new NotFoundError("group");
  const [solvents, reagents, compounds, observations, workups] = await Promise.all([
    db.solvent.findMany({ where: { groupId }, orderBy: { key: "asc" } }),
    db.aqueousReagent.findMany({ where: { groupId }, orderBy: { key: "asc" } }),
    db.compound.findMany({ where: { groupId }, orderBy: byCreation }),
    db.partitionObservation.findMany({ where: { groupId }, orderBy: byCreation }),
    db.workup.findMany({
      where: { groupId }, orderBy: byCreation,
      include: {
        components: { orderBy: { key: "asc" } },
        versions: { orderBy: { version: "asc" } },
        predictions: { orderBy: [{ workupVersion: "asc" }, { createdAt: "asc" }, { id: "asc" }] },
        outcome: true,
        attachments: { orderBy: byCreation },
      },
    }),
  ]);
  const personIds = new Set<string>();
  const person = (id: string | null): string | null => {
    if (id) personIds.add(id);
    return id;
  };
  const library = (rows: typeof solvents) =>
    rows.map((r) => ({ key: r.key, name: r.name, props: r.props as Record<string, JsonIn>, builtin: r.builtin, updatedAt: iso(r.updatedAt) }));
  const document: GroupExport = {
    format: EXPORT_FORMAT, formatVersion: EXPORT_FORMAT_VERSION, exportedAt: new Date().toISOString(), engineVersion: ENGINE_VERSION,
    group: { name: group.name },
    people: [],
    solvents: library(solvents),
    reagents: library(reagents),
    compounds: compounds.map((c) => ({
      ref: c.id, name: c.name, synonyms: c.synonyms, tags: c.tags, canonicalSmiles: c.canonicalSmiles, molfile: c.molfile, formula: c.formula,
      molarMass: c.molarMass, crippenLogP: c.crippenLogP, tpsa: c.tpsa, logP: c.logP, logPSource: c.logPSource, pKas: c.pKas as JsonIn,
      fingerprint: c.fingerprint ? Buffer.from(c.fingerprint).toString("base64") : null, notes: c.notes, createdBy: person(c.createdById),
      createdAt: iso(c.createdAt), updatedAt: iso(c.updatedAt),
    })),
    observations: observations.map((o) => ({
      ref: o.id, compound: o.compoundId, solventKey: o.solventKey, aqueousPh: o.aqueousPh, temperatureC: o.temperatureC, logK: o.logK,
      logKSe: o.logKSe, kind: o.kind, bound: o.bound, method: o.method, weight: o.weight, excluded: o.excluded, workup: o.workupId,
      details: o.details as JsonIn, createdBy: person(o.createdById), createdAt: iso(o.createdAt),
    })),
    workups: workups.map((w) => ({
      ref: w.id, title: w.title, performedOn: iso(w.performedOn), chemist: person(w.chemistId), notebookRef: w.notebookRef, notebookUrl: w.notebookUrl,
      scaleMmol: w.scaleMmol, expectedProductMmol: w.expectedProductMmol, assayedProductMmol: w.assayedProductMmol,
      spec: w.spec as Record<string, JsonIn>, version: w.version, searchText: w.searchText, solventKeys: w.solventKeys, flagged: w.flagged,
      deviationPct: w.deviationPct, status: w.status, createdBy: person(w.createdById), updatedBy: person(w.updatedById),
      createdAt: iso(w.createdAt), updatedAt: iso(w.updatedAt),
      components: w.components.map((c) => ({ key: c.key, name: c.name, role: c.role, amountMmol: c.amountMmol, compound: c.compoundId })),
      versions: w.versions.map((v) => {
        const snapshot = v.snapshot as { header?: { chemistId?: string | null } };
        person(snapshot.header?.chemistId ?? null);
        return { version: v.version, snapshot: v.snapshot as Record<string, JsonIn>, editedBy: person(v.editedById), createdAt: iso(v.createdAt) };
      }),
      predictions: w.predictions.map((p) => ({
        workupVersion: p.workupVersion, engineVersion: p.engineVersion, result: p.result as JsonIn, productRecovery: p.productRecovery,
        recoveryLow: p.recoveryLow, recoveryHigh: p.recoveryHigh, createdAt: iso(p.createdAt),
      })),
      outcome: w.outcome
        ? {
            isolatedMassMg: w.outcome.isolatedMassMg, purityPct: w.outcome.purityPct, purityMethod: w.outcome.purityMethod,
            layerAssays: w.outcome.layerAssays as JsonIn, recoveryPct: w.outcome.recoveryPct, analysis: w.outcome.analysis as JsonIn,
            notes: w.outcome.notes, reportedBy: person(w.outcome.reportedById), createdAt: iso(w.outcome.createdAt), updatedAt: iso(w.outcome.updatedAt),
          }
        : null,
      attachments: w.attachments.map((a) => ({
        fileName: a.fileName, mediaType: a.mediaType, target: a.target, sha256: a.sha256, data: Buffer.from(a.data).toString("base64"),
        thumbnail: a.thumbnail ? Buffer.from(a.thumbnail).toString("base64") : null, createdBy: person(a.createdById), createdAt: iso(a.createdAt),
      })),
    })),
  };
  const people = await db.user.findMany({ where: { id: { in: [...personIds] } }, select: { id: true, name: true, email: true }, orderBy: [{ email: "asc" }] });
  document.people = people.map((u) => ({ ref: u.id, name: u.name, email: u.email }));
  return document;
}
