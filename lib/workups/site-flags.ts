// Structures whose N–H/O–H groups match no ionizable-site class: the prediction treats such a group as neutral at
// every pH, so the workup says so (a warning flag) instead of leaving a silent neutral. A component whose chemist
// recorded a pKa (any provenance but "estimated") has been looked at and gets no flag.
import { estimateSitesWithWarnings, isStructureError, loadRDKit, type RDKitModule } from "@/lib/chem/structure";
import { type Flag } from "@/lib/chem/types";

export const NO_SITE_FLAG_CODE = "S1";

interface LooseComponent {
  key?: unknown;
  name?: unknown;
  smiles?: unknown;
  pKas?: unknown;
}

function componentsOf(spec: unknown): LooseComponent[] {
  const components = (spec as { components?: unknown } | null)?.components;
  return Array.isArray(components) ? components.filter((c): c is LooseComponent => typeof c === "object" && c !== null) : [];
}

const hasRecordedPKa = (pKas: unknown) =>
  Array.isArray(pKas) && pKas.some((p) => typeof p === "object" && p !== null && (p as { provenance?: unknown }).provenance !== "estimated");

/** One warning flag per component whose structure has an N–H/O–H group that no site class covers. */
export function siteFlagsWith(rdkit: RDKitModule, spec: unknown): Flag[] {
  const flags: Flag[] = [];
  for (const c of componentsOf(spec)) {
    if (typeof c.smiles !== "string" || c.smiles.trim() === "" || hasRecordedPKa(c.pKas)) continue;
    let warnings: { message: string }[];
    try {
      warnings = estimateSitesWithWarnings(rdkit, c.smiles).warnings;
    } catch (error) {
      if (isStructureError(error)) continue; // a structure that does not parse is reported by the editor, not here
      throw error;
    }
    const first = warnings[0];
    if (!first) continue;
    const name = typeof c.name === "string" && c.name ? c.name : "A component";
    flags.push({
      code: NO_SITE_FLAG_CODE, severity: "warning", title: "No ionizable site recognised",
      ...(typeof c.key === "string" ? { component: c.key } : {}),
      cause: `${name}: ${first.message} The prediction treats this group as neutral at every pH.`,
      remedy: "Check the group; if it ionises in water, record its measured or literature pKa on the component (or on the registered compound).",
    });
  }
  return flags;
}

export async function siteFlags(spec: unknown): Promise<Flag[]> {
  if (!componentsOf(spec).some((c) => typeof c.smiles === "string" && c.smiles.trim() !== "")) return [];
  return siteFlagsWith(await loadRDKit(), spec);
}
