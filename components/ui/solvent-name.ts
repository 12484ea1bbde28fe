import { SOLVENTS } from "@/lib/chem/data/solvents";

/** A solvent's name for tables that hold only its key; a group's own solvent the built-in list lacks keeps its key. */
export function solventName(key: string): string {
  return SOLVENTS[key]?.name ?? key;
}
