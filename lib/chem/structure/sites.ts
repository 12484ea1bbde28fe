/**
 * Ionizable sites found by substructure patterns, each with its class's default pKa as an estimate. The entries have
 * the shape of the engine's component pKa entry, so a chemist can keep, edit or replace each with a measured or
 * literature value and its source.
 */
import { StructureError } from "./errors";
import { type RDKitModule, type RDKitMol, usingMol } from "./rdkit";
import { parseRDKitJson } from "./rdkit-json";
import { type ReadOptions, readStructure } from "./read";
import { refineSiteValues, type SiteMatch } from "./pka-estimate";
import { graphOf } from "./pka-graph";
import { SITE_CLASSES, type SiteClass } from "./site-classes";

export interface EstimatedPKa {
  value: number;
  /** "acid": HA ⇌ A⁻ + H⁺; "base": the value is the pKa of the conjugate acid BH⁺. */
  kind: "acid" | "base";
  provenance: "estimated";
  source: string;
  /** Standard uncertainty of the class default, log units. */
  se: number;
  /** Class label, e.g. "carboxylic acid (aryl)". */
  site: string;
  /** 0-based atom indices of the group; the ionizable atom comes first. */
  atoms: number[];
}

interface CompiledClass {
  spec: SiteClass;
  queries: RDKitMol[];
}

const compiled = new WeakMap<RDKitModule, CompiledClass[]>();

function compile(rdkit: RDKitModule): CompiledClass[] {
  let classes = compiled.get(rdkit);
  if (!classes) {
    classes = SITE_CLASSES.map((spec) => ({
      spec,
      queries: spec.smarts.map((smarts) => {
        const q = rdkit.get_qmol(smarts);
        if (!q) throw new StructureError("smarts_syntax", `Site pattern ${spec.id} does not parse: ${smarts}`);
        return q;
      }),
    }));
    compiled.set(rdkit, classes);
  }
  return classes;
}

function matches(mol: RDKitMol, query: RDKitMol): number[][] {
  const parsed: unknown = JSON.parse(mol.get_substruct_matches(query));
  if (!Array.isArray(parsed)) return [];
  return parsed.map((m: { atoms?: number[] }) => m.atoms ?? []);
}

export function detectIonizableSites(rdkit: RDKitModule, mol: RDKitMol): EstimatedPKa[] {
  const molecule = parseRDKitJson(mol.get_json());
  const isHetero = (atom: number) => ![1, 6].includes(molecule.atoms[atom]?.z ?? 6);
  const claimed = new Set<number>();
  const found: (SiteMatch & { source: string })[] = [];
  for (const { spec, queries } of compile(rdkit)) {
    const ringsUsed = new Set<number>();
    for (const query of queries) {
      for (const atoms of matches(mol, query)) {
        const siteAtom = atoms[spec.site];
        if (siteAtom === undefined) continue;
        const claims = spec.claim ? spec.claim.map((i) => atoms[i] ?? siteAtom) : atoms.filter(isHetero);
        if (claimed.has(siteAtom) || claims.some((a) => claimed.has(a))) continue;
        claims.forEach((a) => claimed.add(a));
        claimed.add(siteAtom);
        const ring = molecule.atomRings.findIndex((r) => r.includes(siteAtom));
        const second = spec.perRing !== undefined && ring >= 0 && ringsUsed.has(ring);
        if (ring >= 0) ringsUsed.add(ring);
        if (second && spec.perRing === "one") continue;
        const secondValue = second && typeof spec.perRing === "object" ? spec.perRing : undefined;
        const ordered = [siteAtom, ...atoms.filter((a) => a !== siteAtom)];
        found.push({ spec, atom: siteAtom, atoms: ordered, value: secondValue?.pKa ?? spec.pKa, source: secondValue?.source ?? spec.source, fixed: secondValue !== undefined || undefined });
        const extra = spec.second ? atoms[spec.second.site] : undefined;
        if (spec.second && extra !== undefined) {
          claimed.add(extra);
          found.push({ spec, atom: extra, atoms: [extra, ...atoms.filter((a) => a !== extra)], value: spec.second.pKa, source: spec.second.source, fixed: true });
        }
      }
    }
  }
  const values = refineSiteValues(graphOf(molecule), found);
  const sites = found.map((f, i): EstimatedPKa => ({
    value: values[i] ?? f.value,
    kind: f.spec.kind,
    provenance: "estimated",
    source: f.source,
    se: f.spec.se,
    site: f.spec.label,
    atoms: f.atoms,
  }));
  return sites.sort((a, b) => (a.atoms[0] ?? 0) - (b.atoms[0] ?? 0));
}

/** Parses a structure and returns its estimated sites. */
export function estimateIonizableSites(rdkit: RDKitModule, text: string, options: ReadOptions = {}): EstimatedPKa[] {
  return usingMol(readStructure(rdkit, text, options), (mol) => detectIonizableSites(rdkit, mol));
}
