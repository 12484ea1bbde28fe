/**
 * Drying agents. Theoretical capacity is the stoichiometry of the highest hydrate (derived from the hydrate formulas);
 * practical capacity is lower (0.2–0.8 g/g, memory), so the engine recommends 3.5× the theoretical need (at least 3×,
 * common practice; and under the 0.3 load of F23). Hold-up is the solution a gram of spent agent keeps after
 * filtration or decanting (0.5–1 mL/g, memory; better measured once per agent by the group).
 */
import { type Sourced } from "./sources";

export interface DryingAgentProps {
  key: string;
  name: string;
  /** g water per g agent, to the highest hydrate. */
  capacityGPerG: Sourced;
  /** Water left in the gas phase over the agent, mg/L (drying intensity; lower is drier). */
  residualWaterMgPerL: Sourced | null;
  holdUpMlPerG: Sourced;
  speed: "fast" | "slow";
  /** Known interactions the flags mention. */
  retains: ("amines" | "alcohols" | "acids")[];
  removal: "filter" | "decant";
}

const s = (value: number, source: string, confidence: Sourced["confidence"]): Sourced => ({ value, source, confidence });

const list: DryingAgentProps[] = [
  { key: "mgso4", name: "Magnesium sulfate", capacityGPerG: s(1.05, "derived", "derived"), residualWaterMgPerL: s(1, "Robertson", "confirmed"),
    holdUpMlPerG: s(1.0, "memory", "memory"), speed: "fast", retains: ["amines"], removal: "filter" },
  { key: "na2so4", name: "Sodium sulfate", capacityGPerG: s(1.27, "derived", "derived"), residualWaterMgPerL: s(12, "Robertson", "confirmed"),
    holdUpMlPerG: s(0.5, "memory", "memory"), speed: "slow", retains: [], removal: "decant" },
  { key: "cacl2", name: "Calcium chloride", capacityGPerG: s(0.97, "derived", "derived"), residualWaterMgPerL: s(0.036, "Robertson", "confirmed"),
    holdUpMlPerG: s(0.4, "memory", "memory"), speed: "fast", retains: ["alcohols", "amines"], removal: "decant" },
  { key: "caso4", name: "Calcium sulfate (Drierite)", capacityGPerG: s(0.066, "Robertson", "confirmed"), residualWaterMgPerL: s(0.005, "Robertson", "confirmed"),
    holdUpMlPerG: s(0.4, "memory", "memory"), speed: "fast", retains: [], removal: "filter" },
  // K₂CO₃ → sesquihydrate K₂CO₃·1.5H₂O: 27.0/138.2 = 0.20 g/g (derived); basic, so it retains acids.
  { key: "k2co3", name: "Potassium carbonate", capacityGPerG: s(0.2, "derived", "derived"), residualWaterMgPerL: null,
    holdUpMlPerG: s(0.5, "memory", "memory"), speed: "fast", retains: ["acids"], removal: "filter" },
  // 4 Å sieves take up about 20% of their mass of water (memory).
  { key: "sieves_4a", name: "Molecular sieves 4 Å", capacityGPerG: s(0.2, "memory", "memory"), residualWaterMgPerL: null,
    holdUpMlPerG: s(0.3, "memory", "memory"), speed: "slow", retains: [], removal: "decant" },
];

export const DRYING_AGENTS: Readonly<Record<string, DryingAgentProps>> = Object.fromEntries(list.map((a) => [a.key, a]));

/** Multiple of the theoretical agent mass recommended, because practical capacity is far below theoretical (common practice). */
export const DRYING_AGENT_EXCESS = 3.5;

/**
 * Load of an agent = water to take up ÷ its theoretical capacity at the mass used. Above DRYING_AGENT_MAX_LOAD it
 * is overloaded (practical capacity is 0.2–0.8 g/g against about 1 g/g theoretical, memory; the recommended 3.5×
 * the need is a load of 0.29). Below DRYING_AGENT_EXCESS_LOAD (more than twice the recommended mass) it is in clear
 * excess. The two ranges do not overlap, so a step is never told both to add agent and to use less.
 */
export const DRYING_AGENT_MAX_LOAD = 0.3;
export const DRYING_AGENT_EXCESS_LOAD = 1 / (2 * DRYING_AGENT_EXCESS);
