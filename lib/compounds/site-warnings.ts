// The compound page's "no ionizable site recognised: check" notes: N–H/O–H groups of the stored structure that no
// site class covers. A compound on which a chemist recorded a pKa (measured, literature or group value, or a site
// added by hand) has been looked at and shows none.
import { estimateSitesWithWarnings, isStructureError, loadRDKit, type RDKitModule } from "@/lib/chem/structure";
import { type StoredPKa } from "./schemas";

export function siteWarningsWith(rdkit: RDKitModule, compound: { structureText: string; pKas: StoredPKa[] }): string[] {
  if (compound.pKas.some((p) => p.provenance !== "estimated" || !p.atoms?.length)) return [];
  const stored = new Set(compound.pKas.flatMap((p) => p.atoms ?? []));
  try {
    return estimateSitesWithWarnings(rdkit, compound.structureText).warnings.filter((w) => w.atoms.some((a) => !stored.has(a))).map((w) => w.message);
  } catch (error) {
    if (isStructureError(error)) return [];
    throw error;
  }
}

export async function siteWarnings(compound: { structureText: string; pKas: StoredPKa[] }): Promise<string[]> {
  return siteWarningsWith(await loadRDKit(), compound);
}
