/**
 * Loads a group export into a group that holds no compounds, workups or partition data yet, in one transaction:
 * every record gets a new id, references are rewritten, people are matched by email to the group's members, and the
 * group's solvent and reagent library is replaced by the exported one. Exporting the result gives the same document
 * apart from the refs (and people the importing group does not have).
 */
import { createHash } from "node:crypto";
import { type Db } from "@/lib/db/client";
import { isThumbnail, sniffType } from "@/lib/attachments/content";
import { workupInputSchema } from "@/lib/chem/schema";
import { withoutUnknownKeys } from "@/lib/chem/schema-strict";
import { ConflictError, ValidationError, parseInput, type FieldErrors } from "@/lib/errors";
import { audit } from "./audit";
import { LONG_TRANSACTION, type Actor } from "./context";
import { groupExportSchema, type ExportedWorkup, type GroupExport } from "./export-format";
import { newRecordId } from "./ids";
import { asJson } from "./persist";

export interface ImportCounts {
  solvents: number;
  reagents: number;
  compounds: number;
  observations: number;
  workups: number;
  versions: number;
  predictions: number;
  outcomes: number;
  attachments: number;
  /** Emails of exported people who are not members of this group; their references were left empty. */
  unmatchedPeople: string[];
}

/** A stored file as the import writes it: its type is decided again from its bytes, and its checksum must match. */
function attachmentRow(a: ExportedWorkup["attachments"][number], groupId: string, workupId: string, person: (ref: string | null) => string | null) {
  const data = Uint8Array.from(Buffer.from(a.data, "base64"));
  const type = sniffType(data);
  if (!type || createHash("sha256").update(data).digest("hex") !== a.sha256) {
    throw new ValidationError({ attachments: [`${a.fileName}: its content does not match its checksum or is not a kind of file kept here`] });
  }
  const thumbnail = a.thumbnail === null ? null : Uint8Array.from(Buffer.from(a.thumbnail, "base64"));
  return {
    groupId, workupId, target: a.target, fileName: a.fileName, mediaType: type.mediaType, sizeBytes: data.byteLength, sha256: a.sha256, data,
    thumbnail: thumbnail && isThumbnail(thumbnail) ? thumbnail : null, createdById: person(a.createdBy), createdAt: new Date(a.createdAt),
  };
}

/** Every ref must point at a record of the document; specs must still pass the engine's schema. */
function checkConsistency(doc: GroupExport): void {
  const fields: FieldErrors = {};
  const compounds = new Set(doc.compounds.map((c) => c.ref));
  const workups = new Set(doc.workups.map((w) => w.ref));
  const complain = (path: string, message: string) => (fields[path] ??= []).push(message);
  if (compounds.size !== doc.compounds.length) complain("compounds", "two compounds share a ref");
  if (workups.size !== doc.workups.length) complain("workups", "two workups share a ref");
  doc.observations.forEach((o, i) => {
    if (!compounds.has(o.compound)) complain(`observations.${i}.compound`, `no compound with ref '${o.compound}'`);
    if (o.workup !== null && !workups.has(o.workup)) complain(`observations.${i}.workup`, `no workup with ref '${o.workup}'`);
  });
  doc.workups.forEach((w, i) => {
    w.components.forEach((c, j) => {
      if (c.compound !== null && !compounds.has(c.compound)) complain(`workups.${i}.components.${j}.compound`, `no compound with ref '${c.compound}'`);
    });
    // The specs are the exporting app's stored records: keys an older version accepted are dropped, as on every
    // re-read of stored data (validateWorkup's `stored`), not refused.
    const spec = workupInputSchema.safeParse(withoutUnknownKeys(workupInputSchema, w.spec).value);
    if (!spec.success) for (const issue of spec.error.issues) complain(`workups.${i}.spec.${issue.path.join(".")}`, issue.message);
    if (!w.versions.some((v) => v.version === w.version)) complain(`workups.${i}.versions`, `no snapshot of the current version ${w.version}`);
  });
  if (Object.keys(fields).length > 0) throw new ValidationError(fields, "The export document is not consistent.");
}

type Snapshot = { header?: { chemistId?: string | null }; links?: { key: string; compoundId: string | null }[] };

export async function importGroup(db: Db, actor: Actor, body: unknown): Promise<ImportCounts> {
  const doc = parseInput(groupExportSchema, body);
  checkConsistency(doc);
  const { groupId } = actor;
  const compoundId = new Map(doc.compounds.map((c) => [c.ref, newRecordId()]));
  const workupId = new Map(doc.workups.map((w) => [w.ref, newRecordId()]));
  const mapCompound = (ref: string | null) => (ref === null ? null : (compoundId.get(ref) ?? null));
  return db.$transaction(async (tx) => {
    const [hasCompounds, hasWorkups, hasObservations] = await Promise.all([
      tx.compound.count({ where: { groupId } }), tx.workup.count({ where: { groupId } }), tx.partitionObservation.count({ where: { groupId } }),
    ]);
    if (hasCompounds + hasWorkups + hasObservations > 0) {
      throw new ConflictError(
        `An import needs a group with no records; this one has ${hasCompounds} compounds, ${hasWorkups} workups and ${hasObservations} partition observations.`,
      );
    }
    const members = await tx.membership.findMany({ where: { groupId }, select: { user: { select: { id: true, email: true } } } });
    const byEmail = new Map(members.map((m) => [m.user.email.toLowerCase(), m.user.id]));
    const personId = new Map(doc.people.map((p) => [p.ref, byEmail.get(p.email.toLowerCase()) ?? null]));
    const person = (ref: string | null) => (ref === null ? null : (personId.get(ref) ?? null));
    const unmatchedPeople = doc.people.filter((p) => !personId.get(p.ref)).map((p) => p.email);

    await tx.solvent.deleteMany({ where: { groupId } });
    await tx.aqueousReagent.deleteMany({ where: { groupId } });
    const library = (rows: GroupExport["solvents"]) =>
      rows.map((r) => ({ groupId, key: r.key, name: r.name, props: asJson(r.props), builtin: r.builtin, updatedAt: new Date(r.updatedAt) }));
    await tx.solvent.createMany({ data: library(doc.solvents) });
    await tx.aqueousReagent.createMany({ data: library(doc.reagents) });
    await tx.compound.createMany({
      data: doc.compounds.map(({ ref, fingerprint, createdBy, createdAt, updatedAt, pKas, ...c }) => ({
        ...c, id: compoundId.get(ref)!, groupId, pKas: asJson(pKas), createdById: person(createdBy),
        fingerprint: fingerprint === null ? null : new Uint8Array(Buffer.from(fingerprint, "base64")),
        createdAt: new Date(createdAt), updatedAt: new Date(updatedAt),
      })),
    });
    await tx.workup.createMany({ data: doc.workups.map((w) => workupRow(w, workupId.get(w.ref)!, groupId, person)) });
    const each = <T>(pick: (w: ExportedWorkup, id: string) => T[]) => doc.workups.flatMap((w) => pick(w, workupId.get(w.ref)!));
    const components = each((w, id) => w.components.map(({ compound, ...c }) => ({ ...c, groupId, workupId: id, compoundId: mapCompound(compound) })));
    await tx.workupComponent.createMany({ data: components });
    const versions = each((w, id) => w.versions.map((v) => {
      const snapshot = structuredClone(v.snapshot) as Snapshot;
      if (snapshot.header && "chemistId" in snapshot.header) snapshot.header.chemistId = person(snapshot.header.chemistId ?? null);
      if (Array.isArray(snapshot.links)) snapshot.links = snapshot.links.map((l) => ({ ...l, compoundId: mapCompound(l.compoundId) }));
      return { groupId, workupId: id, version: v.version, snapshot: asJson(snapshot), editedById: person(v.editedBy), createdAt: new Date(v.createdAt) };
    }));
    await tx.workupVersion.createMany({ data: versions });
    const predictions = each((w, id) => w.predictions.map((p) => ({ ...p, groupId, workupId: id, result: asJson(p.result), createdAt: new Date(p.createdAt) })));
    await tx.prediction.createMany({ data: predictions });
    const outcomes = each((w, id) => (w.outcome ? [w.outcome] : []).map(({ reportedBy, createdAt, updatedAt, layerAssays, analysis, ...o }) => ({
      ...o, groupId, workupId: id, reportedById: person(reportedBy), layerAssays: asJson(layerAssays), analysis: asJson(analysis),
      createdAt: new Date(createdAt), updatedAt: new Date(updatedAt),
    })));
    await tx.outcome.createMany({ data: outcomes });
    const attachments = each((w, id) => w.attachments.map((a) => attachmentRow(a, groupId, id, person)));
    if (attachments.length) await tx.attachment.createMany({ data: attachments });
    await tx.partitionObservation.createMany({
      data: doc.observations.map(({ ref: _ref, compound, workup, createdBy, createdAt, details, ...o }) => ({
        ...o, groupId, id: newRecordId(), compoundId: compoundId.get(compound)!, workupId: workup === null ? null : (workupId.get(workup) ?? null),
        details: asJson(details), createdById: person(createdBy), createdAt: new Date(createdAt),
      })),
    });
    const counts: ImportCounts = {
      solvents: doc.solvents.length, reagents: doc.reagents.length, compounds: doc.compounds.length, observations: doc.observations.length,
      workups: doc.workups.length, versions: versions.length, predictions: predictions.length, outcomes: outcomes.length, attachments: attachments.length, unmatchedPeople,
    };
    await audit(tx, actor, "group.import", groupId, { ...counts, exportedAt: doc.exportedAt, fromGroup: doc.group.name });
    return counts;
  }, LONG_TRANSACTION);
}

function workupRow(w: ExportedWorkup, id: string, groupId: string, person: (ref: string | null) => string | null) {
  return {
    id, groupId, title: w.title, performedOn: new Date(w.performedOn), chemistId: person(w.chemist), notebookRef: w.notebookRef, notebookUrl: w.notebookUrl,
    scaleMmol: w.scaleMmol, expectedProductMmol: w.expectedProductMmol, assayedProductMmol: w.assayedProductMmol, spec: asJson(w.spec),
    version: w.version, searchText: w.searchText, solventKeys: w.solventKeys, flagged: w.flagged, deviationPct: w.deviationPct,
    status: w.status, createdById: person(w.createdBy), updatedById: person(w.updatedBy),
    createdAt: new Date(w.createdAt), updatedAt: new Date(w.updatedAt),
  };
}
