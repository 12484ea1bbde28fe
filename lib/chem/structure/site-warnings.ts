/**
 * N–H and O–H groups that no site class recognised. Groups known to stay un-ionised between pH 0 and 14 are left
 * out (alcohols pKa ≈ 15–16, amides, carbamates and ureas pKa > 14 and pKaH < 0, pyrrole/indole N–H ≈ 17,
 * diarylamines pKaH ≈ 1; CRC Handbook, dissociation constants of organic acids and bases, from memory). Anything
 * else (an N–OH, an enol, a phosphate ester, an imine N–H, a hydrazine...) may ionise in a workup: rather than treat
 * the compound as silently neutral, it carries a warning so a chemist checks it and records a value.
 */
import { StructureError } from "./errors";
import { type RDKitModule, type RDKitMol, usingMol } from "./rdkit";
import { parseRDKitJson } from "./rdkit-json";
import { type ReadOptions, readStructure } from "./read";
import { type EstimatedPKa, detectIonizableSites } from "./sites";

export const NO_SITE_WARNING = "no ionizable site recognised: check";

export interface SiteWarning {
  /** Always starts with NO_SITE_WARNING. */
  message: string;
  /** 0-based indices of the N and O atoms concerned. */
  atoms: number[];
}

/** Non-ionizable X–H between pH 0 and 14 (see the file comment for the values). */
const NEUTRAL_XH = [
  "[OX2H2,OX1H1-,OX3H3+]", // water of crystallisation, hydroxide, hydronium: the solvent's own ions
  "[OX2H1][CX4]", // alcohol
  "[OX2H1][Si]", // silanol: weakly acidic (pKa ≈ 11-13) but not ionised in a workup
  "[#7X3;!H0][#6X3]=[O,S]", // amide, lactam, carbamate, urea, thioamide
  "[#7X3;!H0][#6X3]=[#7]", // N–H of an amidine/guanidine tautomer beside the recognised site
  "[#7;!H0]:[#6]=[O]", // aromatic lactam (pyridone, uracil N1)
  "[nH1;r5]", // pyrrole, indole, carbazole N–H
  "[NX3;H1](a)a", // diarylamine
  "[#7X3;!H0]-[#7X3]-[#6X3]=O", // hydrazide terminal N–H
  "[#7X3;!H0]S(=O)(=O)", // sulfonamide N–H not acidic enough to count (N,N'-disubstituted sulfamides)
];

const compiled = new WeakMap<RDKitModule, RDKitMol[]>();

function neutralQueries(rdkit: RDKitModule): RDKitMol[] {
  let queries = compiled.get(rdkit);
  if (!queries) {
    queries = NEUTRAL_XH.map((smarts) => {
      const q = rdkit.get_qmol(smarts);
      if (!q) throw new StructureError("smarts_syntax", `Neutral-group pattern does not parse: ${smarts}`);
      return q;
    });
    compiled.set(rdkit, queries);
  }
  return queries;
}

/** The N–H/O–H atoms of `mol` outside every site in `sites` and every known non-ionizable group. */
export function unrecognisedProtonGroups(rdkit: RDKitModule, mol: RDKitMol, sites: EstimatedPKa[]): SiteWarning[] {
  const molecule = parseRDKitJson(mol.get_json());
  const covered = new Set(sites.flatMap((s) => s.atoms));
  for (const q of neutralQueries(rdkit)) {
    const parsed: unknown = JSON.parse(mol.get_substruct_matches(q));
    if (!Array.isArray(parsed)) continue;
    for (const m of parsed as { atoms?: number[] }[]) {
      const first = m.atoms?.[0];
      if (first !== undefined) covered.add(first);
    }
  }
  const hNeighbours = new Map<number, number>();
  for (const b of molecule.bonds) {
    const [x, y] = b.atoms;
    if (molecule.atoms[x]?.z === 1) hNeighbours.set(y, (hNeighbours.get(y) ?? 0) + 1);
    if (molecule.atoms[y]?.z === 1) hNeighbours.set(x, (hNeighbours.get(x) ?? 0) + 1);
  }
  const atoms = molecule.atoms.flatMap((a, i) => ((a.z === 7 || a.z === 8) && a.impHs + (hNeighbours.get(i) ?? 0) > 0 && !covered.has(i) ? [i] : []));
  if (atoms.length === 0) return [];
  const what = [...new Set(atoms.map((i) => (molecule.atoms[i]?.z === 8 ? "O–H" : "N–H")))].join("/");
  const where = `${atoms.length > 1 ? "atoms" : "atom"} ${atoms.map((i) => i + 1).join(", ")}`;
  return [{ message: `${NO_SITE_WARNING} the ${what} at ${where} (no site class covers it); record a measured or literature pKa if it ionises in water.`, atoms }];
}

/** Sites and warnings of a structure given as SMILES or a MOL block. */
export function estimateSitesWithWarnings(rdkit: RDKitModule, text: string, options: ReadOptions = {}): { sites: EstimatedPKa[]; warnings: SiteWarning[] } {
  return usingMol(readStructure(rdkit, text, options), (mol) => {
    const sites = detectIonizableSites(rdkit, mol);
    return { sites, warnings: unrecognisedProtonGroups(rdkit, mol, sites) };
  });
}
