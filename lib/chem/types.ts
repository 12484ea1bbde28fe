/**
 * Result types of a prediction. All amounts in mmol, volumes in mL, densities in g/mL, masses in mg unless the
 * field name says otherwise. Plain JSON: the app stores results as they are.
 */

export type Severity = "info" | "warning" | "danger";
export type LayerKind = "organic" | "aqueous";
export type LayerPosition = "top" | "bottom" | "single";

/** A risk flag: what the model sees, why it matters, what to do. */
export interface Flag {
  code: string;
  severity: Severity;
  title: string;
  /** 1-based step index, when a single step triggers it. */
  step?: number;
  component?: string;
  cause: string;
  remedy: string;
}

/** A safety prompt shown beside the step that triggers it; it defers to local rules and the safety plan. */
export interface Caution {
  code: "gas_evolution" | "exotherm" | "peroxide_former" | "chlorinated_waste" | "volatile_solvent_pressure"
    | "hydrogen_fluoride" | "cyanide" | "azide" | "reactive_quench" | "heavy_metal_waste" | "reproductive_toxicant";
  step: number;
  text: string;
}

export interface SpeciesAmounts {
  /** mmol of the uncharged form (all sites neutral). */
  neutral: number;
  /** mmol of every charged form, zwitterions included. */
  charged: number;
}

export interface PhaseState {
  kind: LayerKind;
  volumeMl: number;
  densityGPerMl: number;
  position: LayerPosition;
  /** Aqueous phases only. */
  pH: number | null;
  /** Ionic strength of an aqueous phase, mol/L. */
  ionicStrength: number | null;
  /** Volume of each solvent in the phase, water included. */
  solventsMl: Record<string, number>;
  components: Record<string, SpeciesAmounts>;
  /** Distribution ratio D = C_org/C_aq (total over species) of each component at this contact. */
  distributionRatio?: Record<string, number>;
}

/** One equilibration of an organic and an aqueous phase (one portion of a wash or extraction). */
export interface ContactResult {
  portion: number;
  phases: PhaseState[];
  /** ρ_org − ρ_aq, g/mL; negative means the organic layer floats. */
  densityDifference: number | null;
  co2Mmol: number;
  co2GasMl: number;
  heatKJ: number;
  temperatureRiseK: number;
  /** A basic or acidic wash whose buffer was used up: pH moved > 1 unit from the fresh reagent's pH. */
  capacityExceeded: boolean;
  /** Fresh reagent pH and the pH after contact, for the capacity check. */
  reagentPh: number | null;
}

export interface StreamSummary {
  kind: LayerKind | "residue" | "solid" | "mixture" | "empty";
  volumeMl: number;
  solventsMl: Record<string, number>;
  components: Record<string, number>;
}

export interface StepResult {
  index: number;
  type: string;
  label: string;
  /** Equilibrium phases of every contact in this step (one per portion; one for a single mixing). */
  contacts: ContactResult[];
  /** The stream carried forward after the step. */
  kept: StreamSummary;
  /** Streams produced and not kept: saved under a name, discarded to waste, held on a solid. */
  sideStreams: SideStream[];
  /** Step-specific numbers (water removed, agent needed, reagent added to reach a target pH, …). */
  details: Record<string, number | string | boolean>;
}

export interface SideStream {
  step: number;
  name: string;
  fate: "saved" | "waste" | "drying_agent" | "filter_cake" | "evaporated" | "combined";
  wasteClass?: "aqueous" | "halogenated_organic" | "non_halogenated_organic" | "solid";
  volumeMl: number;
  components: Record<string, number>;
}

export interface ComponentOutcome {
  key: string;
  name: string;
  role: string;
  startMmol: number;
  isolatedMmol: number;
  /** Fraction of the starting amount in the isolated fraction, 0–1. */
  recovery: number;
  isolatedMg: number;
  /** Mass % of the crude, residual solvents included. */
  purityPct: number;
}

/** Fractions (0–1) of a component's starting amount lost, by where it went (losses.ts). */
export interface ComponentLosses {
  aqueous: number;
  organic: number;
  drying_agent: number;
  filter_cake: number;
  evaporated: number;
}

export interface WorkupPrediction {
  engineVersion: string;
  steps: StepResult[];
  isolated: StreamSummary;
  components: ComponentOutcome[];
  recovery: Record<string, number>;
  purityPct: Record<string, number>;
  crudeMassMg: number;
  /** High-boiling solvents predicted to remain in the crude, mg. */
  residualSolventsMg: Record<string, number>;
  productKey: string | null;
  /** Every stream that left the main line, with its fate; with `isolated` it closes the mass balance. */
  sideStreams: SideStream[];
  /** Each component's losses by destination (absent in predictions stored before it was added). */
  losses?: Record<string, ComponentLosses>;
  flags: Flag[];
  cautions: Caution[];
}
