/**
 * Abraham solute descriptors of a structure by the Platts group contribution (fragment values and matching rules
 * in data/abraham-groups.ts), with V computed exactly. Done once per compound, never per prediction: the result is
 * component data (component.abraham, provenance "estimated") for the pure engine.
 */
import { ATOM_FRAGMENTS, CORRECTION_FRAGMENTS, PLATTS_INTERCEPT, type AbrahamFragment } from "../data/abraham-groups";
import { type AbrahamDescriptors } from "../data/abraham-solutes";
import { mcGowanVolumeOf } from "./mcgowan";
import { type RDKitModule, type RDKitMol } from "./rdkit";
import { parseRDKitJson } from "./rdkit-json";

export interface EstimatedDescriptors extends Required<AbrahamDescriptors> {
  provenance: "estimated";
  /** The fragments used, by RMG-database label, e.g. ["CssH3", "CssH3", "Oss", …]. */
  fragments: string[];
}

interface Compiled { fragment: AbrahamFragment; query: RDKitMol }
const compiled = new WeakMap<RDKitModule, { atoms: Compiled[]; corrections: Compiled[] }>();

function compile(rdkit: RDKitModule) {
  let c = compiled.get(rdkit);
  if (!c) {
    const q = (fragment: AbrahamFragment): Compiled => {
      const query = rdkit.get_qmol(fragment.smarts);
      if (!query) throw new Error(`Abraham fragment ${fragment.label} does not parse: ${fragment.smarts}`);
      return { fragment, query };
    };
    c = { atoms: ATOM_FRAGMENTS.map(q), corrections: CORRECTION_FRAGMENTS.map(q) };
    compiled.set(rdkit, c);
  }
  return c;
}

function matches(mol: RDKitMol, query: RDKitMol): number[][] {
  const parsed: unknown = JSON.parse(mol.get_substruct_matches(query));
  return Array.isArray(parsed) ? parsed.map((m: { atoms?: number[] }) => m.atoms ?? []) : [];
}

/**
 * Estimated descriptors, or null when a heavy atom has no fragment (halogens, phosphorus, boron, silicon, charged
 * nitrogen other than nitro) or the molecule has no heavy atom.
 */
export function estimateAbrahamDescriptors(rdkit: RDKitModule, mol: RDKitMol): EstimatedDescriptors | null {
  const molecule = parseRDKitJson(mol.get_json());
  const heavy = molecule.atoms.map((a) => a.z !== 1);
  if (!heavy.some(Boolean)) return null;
  const V = mcGowanVolumeOf(molecule);
  if (!Number.isFinite(V)) return null;
  const { atoms, corrections } = compile(rdkit);
  const sum = { ...PLATTS_INTERCEPT };
  const fragments: string[] = [];
  const add = (fr: AbrahamFragment) => {
    sum.E += fr.E; sum.S += fr.S; sum.A += fr.A; sum.B += fr.B; sum.L += fr.L;
    fragments.push(fr.label);
  };
  // Each fragment counts once per centre atom (its pattern's first atom), whatever else the pattern matched.
  const addPerCentre = (list: typeof atoms): Set<number> => {
    const centres = new Set<number>();
    for (const { fragment, query } of list) {
      for (const m of matches(mol, query)) {
        const centre = m[0];
        if (centre === undefined || centres.has(centre)) continue;
        centres.add(centre);
        add(fragment);
      }
    }
    return centres;
  };
  const covered = addPerCentre(atoms);
  for (let i = 0; i < heavy.length; i++) if (heavy[i] && !covered.has(i)) return null;
  addPerCentre(corrections);
  const r = (x: number) => Math.round(x * 1000) / 1000;
  return { E: r(sum.E), S: r(sum.S), A: r(Math.max(0, sum.A)), B: r(Math.max(0, sum.B)), L: r(sum.L), V: Math.round(V * 10000) / 10000,
    provenance: "estimated", fragments };
}
