/**
 * What the simulator remembers about each contact and step, for the failure-mode flags and safety cautions.
 * Kept apart from the public result so the Monte-Carlo path can skip building the public per-step detail.
 */
import { type OperationType } from "./schema";

export interface ContactTrace {
  step: number;
  opType: OperationType;
  portion: number;
  /** Which layer the operation keeps at this contact (null for a mixing without separation). */
  keep: "organic" | "aqueous" | null;
  reagentKey: string | null;
  /** pH of the fresh reagent (NaN if none). */
  reagentPh: number;
  pH: number;
  organicVolume: number;
  aqueousVolume: number;
  organicDensity: number;
  aqueousDensity: number;
  twoPhase: boolean;
  organicOnTop: boolean;
  /** Immiscible organic solvents are mostly chlorinated (the usual order is organic at the bottom). */
  chlorinatedOrganic: boolean;
  /** Volume share in all the liquid of water-miscible solvents (dipolar aprotic ones counted apart), and the
   * fraction of all water-miscible solvents in the aqueous layer. */
  cosolventShare: number;
  dipolarShare: number;
  cosolventFractionAqueous: number;
  saltM: number;
  distribution: Float64Array;
  fractionNeutral: Float64Array;
  fractionAqueous: Float64Array;
  /** mmol of each component in the contact. */
  amounts: Float64Array;
  /** mmol of each component leaving the main line at this contact (to the layer not kept). */
  lost: Float64Array;
  co2Mmol: number;
  heatKJ: number;
  temperatureRiseK: number;
  capacityExceeded: boolean;
  liquidVolume: number;
  temperatureC: number;
  /** Solvent keys of the organic layer with volume > 0. */
  organicSolvents: string[];
}

export interface StepTrace {
  index: number;
  type: OperationType;
  details: Record<string, number | string | boolean>;
  firstContact: number;
  contactCount: number;
}
