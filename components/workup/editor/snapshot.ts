// The editor state in the shape a saved version keeps (header, spec as entered, links), so the version diff can
// compare unsaved edits with a saved version.
import type { WorkupDetail } from "@/lib/workups/queries";
import type { WorkupSnapshot } from "@/lib/workups/record";
import { type EditorState } from "@/lib/workups-client/editor-types";
import { linksInput, parseNumber, specInput } from "@/lib/workups-client/to-spec";

export function snapshotOfState(state: EditorState): WorkupSnapshot {
  const h = state.header;
  const mmol = (t: string) => parseNumber(t) ?? null;
  return {
    header: {
      title: h.title.trim(), performedOn: h.performedOn, chemistId: h.chemistId || null, notebookRef: h.notebookRef.trim(), notebookUrl: h.notebookUrl.trim(),
      scaleMmol: mmol(h.scaleMmol), expectedProductMmol: mmol(h.expectedProductMmol), assayedProductMmol: mmol(h.assayedProductMmol),
    },
    spec: JSON.parse(JSON.stringify(specInput(state))) as WorkupSnapshot["spec"],
    links: linksInput(state),
  };
}

export function snapshotOfDetail(d: Pick<WorkupDetail, "header" | "spec" | "components">): WorkupSnapshot {
  return { header: d.header, spec: d.spec, links: d.components.filter((c) => c.compound !== null).map((c) => ({ key: c.key, compoundId: c.compound?.id ?? null })) };
}
