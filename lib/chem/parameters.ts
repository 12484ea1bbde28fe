/**
 * The numbers of a work-up that change between predictions of the same procedure: each component's log P, own
 * log K values, pKa values, ion-pair extraction constants and amount; the starting volumes; each operation's volume, amount, target pH and rinse
 * volume. The simulator reads them from these flat arrays rather than from the input objects, so a Monte-Carlo
 * draw or a bulk re-prediction rewrites numbers in place instead of building a perturbed copy of the input.
 */
import { engineSolventKeys } from "./library";
import { type Component, type LogValue, type WorkupInput } from "./schema";

export interface WorkupParameters {
  /** Octanol–water log P per component; NaN when the component gives none. */
  logP: Float64Array;
  /** The components' own log K values, component c's in its record's key order from logKStart[c]. */
  logK: Float64Array;
  logKStart: Int32Array;
  /** pKa values, component c's in its listed order from pKaStart[c]. */
  pKa: Float64Array;
  pKaStart: Int32Array;
  /** The components' own ion-pair extraction constants (log K_ex), component c's in listed order from
   * ionPairStart[c]. */
  ionPairLogKex: Float64Array;
  ionPairStart: Int32Array;
  amountMmol: Float64Array;
  mixtureSolventMl: Float64Array;
  mixtureReagentMl: Float64Array;
  /** Per operation; NaN where the operation has no such field. */
  volumeMl: Float64Array;
  operationAmountMmol: Float64Array;
  targetPh: Float64Array;
  rinseMl: Float64Array;
  /** Shift of each solvent's ion-pair constants (log units), in the compiled library's solvent order; 0 as read. */
  ionPairShift: Float64Array;
}

const sized = (a: Float64Array, n: number): Float64Array => (a.length === n ? a : new Float64Array(n));
const sizedInt = (a: Int32Array, n: number): Int32Array => (a.length === n ? a : new Int32Array(n));
const EMPTY = new Float64Array(0);
const EMPTY_INT = new Int32Array(0);

export function emptyParameters(): WorkupParameters {
  return {
    logP: EMPTY, logK: EMPTY, logKStart: EMPTY_INT, pKa: EMPTY, pKaStart: EMPTY_INT, ionPairLogKex: EMPTY, ionPairStart: EMPTY_INT, amountMmol: EMPTY,
    mixtureSolventMl: EMPTY, mixtureReagentMl: EMPTY, volumeMl: EMPTY, operationAmountMmol: EMPTY, targetPh: EMPTY, rinseMl: EMPTY,
    ionPairShift: EMPTY,
  };
}

/** Reads the component parameters (log P, own log K, pKa, amount) of `components` into `out`. */
export function readComponentParameters(comps: readonly Component[], out: WorkupParameters): void {
  const n = comps.length;
  let nLogK = 0, nPKa = 0, nPair = 0;
  for (const c of comps) {
    for (const key in c.logK) if (Object.hasOwn(c.logK, key)) nLogK++;
    nPKa += c.pKas.length;
    nPair += c.ionPairLogKex.length;
  }
  out.logP = sized(out.logP, n);
  out.amountMmol = sized(out.amountMmol, n);
  out.logK = sized(out.logK, nLogK);
  out.pKa = sized(out.pKa, nPKa);
  out.logKStart = sizedInt(out.logKStart, n + 1);
  out.pKaStart = sizedInt(out.pKaStart, n + 1);
  out.ionPairLogKex = sized(out.ionPairLogKex, nPair);
  out.ionPairStart = sizedInt(out.ionPairStart, n + 1);
  let k = 0, q = 0, e = 0;
  for (let ci = 0; ci < n; ci++) {
    const c = comps[ci] as Component;
    out.logP[ci] = c.logP ? c.logP.value : Number.NaN;
    out.amountMmol[ci] = c.amountMmol;
    out.logKStart[ci] = k;
    out.pKaStart[ci] = q;
    out.ionPairStart[ci] = e;
    for (const key in c.logK) if (Object.hasOwn(c.logK, key)) out.logK[k++] = (c.logK[key] as LogValue).value;
    for (const p of c.pKas) out.pKa[q++] = p.value;
    for (const x of c.ionPairLogKex) out.ionPairLogKex[e++] = x.value;
  }
  out.logKStart[n] = k;
  out.pKaStart[n] = q;
  out.ionPairStart[n] = e;
}

/** Reads the parameters of `input` into `out`, reallocating only the arrays whose length changes. `solventKeys`:
 * the compiled library's solvents for this work-up, when the caller has them (engineSolventKeys otherwise). */
export function readParameters(input: WorkupInput, out: WorkupParameters = emptyParameters(), solventKeys?: readonly string[]): WorkupParameters {
  readComponentParameters(input.components, out);
  const { solvents, reagents } = input.mixture;
  out.mixtureSolventMl = sized(out.mixtureSolventMl, solvents.length);
  out.mixtureReagentMl = sized(out.mixtureReagentMl, reagents.length);
  for (let i = 0; i < solvents.length; i++) out.mixtureSolventMl[i] = (solvents[i] as { volumeMl: number }).volumeMl;
  for (let i = 0; i < reagents.length; i++) out.mixtureReagentMl[i] = (reagents[i] as { volumeMl: number }).volumeMl;
  const ops = input.operations;
  const m = ops.length;
  out.volumeMl = sized(out.volumeMl, m);
  out.operationAmountMmol = sized(out.operationAmountMmol, m);
  out.targetPh = sized(out.targetPh, m);
  out.rinseMl = sized(out.rinseMl, m);
  for (let i = 0; i < m; i++) {
    const op = ops[i] as Partial<Record<"volumeMl" | "amountMmol" | "targetPh", number>> & { rinse?: { volumeMl: number } };
    out.volumeMl[i] = op.volumeMl ?? Number.NaN;
    out.operationAmountMmol[i] = op.amountMmol ?? Number.NaN;
    out.targetPh[i] = op.targetPh ?? Number.NaN;
    out.rinseMl[i] = op.rinse ? op.rinse.volumeMl : Number.NaN;
  }
  const keys = solventKeys ?? engineSolventKeys(input);
  out.ionPairShift = sized(out.ionPairShift, keys.length);
  const shift = input.ionPairShift;
  if (shift === undefined) out.ionPairShift.fill(0);
  else for (let i = 0; i < keys.length; i++) out.ionPairShift[i] = shift[keys[i] as string] ?? 0;
  return out;
}

/** A copy with its own arrays. */
export function copyParameters(p: WorkupParameters): WorkupParameters {
  return {
    logP: p.logP.slice(), logK: p.logK.slice(), logKStart: p.logKStart.slice(), pKa: p.pKa.slice(), pKaStart: p.pKaStart.slice(),
    ionPairLogKex: p.ionPairLogKex.slice(), ionPairStart: p.ionPairStart.slice(),
    amountMmol: p.amountMmol.slice(), mixtureSolventMl: p.mixtureSolventMl.slice(), mixtureReagentMl: p.mixtureReagentMl.slice(),
    volumeMl: p.volumeMl.slice(), operationAmountMmol: p.operationAmountMmol.slice(), targetPh: p.targetPh.slice(), rinseMl: p.rinseMl.slice(),
    ionPairShift: p.ionPairShift.slice(),
  };
}

/** Copies every value of `from` into `to` (same layout). */
export function assignParameters(to: WorkupParameters, from: WorkupParameters): void {
  to.logP.set(from.logP);
  to.logK.set(from.logK);
  to.pKa.set(from.pKa);
  to.ionPairLogKex.set(from.ionPairLogKex);
  to.amountMmol.set(from.amountMmol);
  to.mixtureSolventMl.set(from.mixtureSolventMl);
  to.mixtureReagentMl.set(from.mixtureReagentMl);
  to.volumeMl.set(from.volumeMl);
  to.operationAmountMmol.set(from.operationAmountMmol);
  to.targetPh.set(from.targetPh);
  to.rinseMl.set(from.rinseMl);
  to.ionPairShift.set(from.ionPairShift);
}
