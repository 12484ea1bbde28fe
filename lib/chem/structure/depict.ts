/** 2D depictions as SVG text. RDKit lays out SMILES input itself and keeps the coordinates of a MOL block. */
import { type RDKitModule, usingMol } from "./rdkit";
import { type ReadOptions, readStructure } from "./read";

export interface DepictOptions extends ReadOptions {
  /** Pixels; default 300 × 220. */
  width?: number;
  height?: number;
  /** 0-based atom indices to highlight, e.g. an ionizable site. */
  highlightAtoms?: number[];
}

export function depictSvg(rdkit: RDKitModule, text: string, options: DepictOptions = {}): string {
  const width = clampSize(options.width ?? 300);
  const height = clampSize(options.height ?? 220);
  return usingMol(readStructure(rdkit, text, options), (mol) =>
    mol.get_svg_with_highlights(JSON.stringify({ width, height, atoms: options.highlightAtoms ?? [], bonds: [] })),
  );
}

function clampSize(px: number): number {
  return Math.round(Math.min(2000, Math.max(50, px)));
}
