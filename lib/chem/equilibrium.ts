/**
 * One equilibration of a mixed stream into an organic and an aqueous layer: phase volumes (phases.ts), the
 * log K of every component corrected for the organic layer's composition (log-linear mixing of the solvents'
 * values, an assumption), salting out and cosolvency (partition.ts), then the pH by charge balance with every
 * component distributing between the layers inside the residual (aqueous.ts). Ions enter the organic layer as
 * ion pairs with the water's counter-ions (ion-pair.ts). CO₂ above saturation leaves as gas inside the same
 * solve (the carbonate is capped at saturation with the headspace). Results stay in the instance (typed arrays reused between contacts).
 * The charge balance is solved by safeguarded Newton steps on its analytic slope (aqueous.ts): from the pH of
 * the previous contact, or of the same contact in the previous Monte-Carlo draw, it needs three to five
 * evaluations. Components with no acidic or basic site carry no charge and are left out of the evaluations.
 * One class over 300 lines on purpose: the per-contact state the charge-balance loop reads lives in its fields.
 */
import { DAVIES_A, daviesTerm } from "./activity";
import { co2SaturationM, KW, NEWTON_STEP_TOLERANCE, PH_MAX, PH_MIN, solvePhWithSlope, type SlopedChargeBalance } from "./aqueous";
import { type CompiledComponents } from "./components";
import { CARBONATE, N_SYSTEMS, SYSTEM_KA, SYSTEM_Z0, WATER, type CompiledLibrary } from "./library";
import { saltingOutShift } from "./partition";
import { PhaseSplit } from "./phases";
import { ionPairOffset } from "./ion-pair";
import { copyInto, type Stream } from "./stream";

/** The pH (and 10^−pH) and ionic strength a contact reached in an earlier run: where later runs' searches for
 * the same contact start. */
export interface PhMemo {
  pH: number;
  h: number;
  /** Ionic strength the contact settled at, mol/L (NaN until solved). */
  ionicStrength: number;
}

/** Change of −log γ± below which the ionic strength counts as settled (see equilibrate). */
const ACTIVITY_TOLERANCE = 1e-9;

/** Newton steps (pH) below which the joint pH–activity refinement takes over from the search with γ held, and
 * above which it hands back (0.5: a Monte-Carlo draw's start, the nominal pH of its contact, is often a few tenths
 * off, and handing back at 0.1 cost about two evaluations there); and its most steps. */
const JOINT_ENTRY_STEP = 0.02;
const JOINT_MAX_STEP = 0.5;
const MAX_JOINT_STEPS = 20;

/** 1/k! for the series of e^u the joint steps use for the small changes of 10^−pH and 1/γ± between steps (a
 * call to Math.exp leaves compiled code for a C function); cut where the next term is below 1e-17, as shiftH
 * (aqueous.ts) cuts it. */
const E2 = 1 / 2, E3 = 1 / 6, E4 = 1 / 24, E5 = 1 / 120, E6 = 1 / 720, E7 = 1 / 5040, E8 = 1 / 40320;

/** Weight of each system's total in the ionic strength estimate, max(1, z₀²). */
const SYSTEM_Z2_WEIGHT = Float64Array.from(SYSTEM_Z0, (z0) => Math.max(1, z0 * z0));

/** Charge-balance evaluations since the module loaded (all equilibrators): a machine-independent cost figure that
 * bench/chem.bench.ts reports. */
export const solverStats = { evaluations: 0 };

export class Equilibrator implements SlopedChargeBalance {
  readonly phases: PhaseSplit;
  kNeutral: Float64Array;
  kIon: Float64Array;
  /** Distribution ratio, neutral fraction (aqueous speciation) and fraction in the aqueous layer, per component. */
  distribution: Float64Array;
  fractionNeutral: Float64Array;
  fractionAqueous: Float64Array;
  pH = NaN;
  co2Mmol = 0;
  /** d(residual)/d(pH) at the last evaluated pH, and 10^−pH at the pH last solved for. */
  slope = 0;
  rootH = Number.NaN;
  /** Last solved pH, the starting guess for the next contact unless the caller gives one. */
  lastSolved = NaN;
  /** The pH and a(H⁺) evaluate() reads, and the residual it leaves. */
  private evalPh = Number.NaN;
  private evalH = Number.NaN;
  private residual = Number.NaN;
  /** refine()'s start (pH, a(H⁺), ionic strength for γ or NaN) and its root or NaN. */
  private refineX = Number.NaN;
  private refineH = Number.NaN;
  private refineNext = Number.NaN;
  private refined = Number.NaN;

  private systemTotals = new Float64Array(N_SYSTEMS);
  /** The prepared mixture holds some acid–base system (else systemTotals is stale and counts as zero). */
  private systemsPresent = false;
  /** Indices of the acid–base systems present in this contact, and how many. */
  private active = new Int32Array(N_SYSTEMS);
  private nActive = 0;
  private strongConc = 0;
  private strongZ2Conc = 0;
  /** Per contact: each system's total and each component's amount over the aqueous volume, and V_org/V_aq. */
  private systemConc = new Float64Array(N_SYSTEMS);
  private amountConc: Float64Array;
  private voOverVa = 0;
  private va = 0;
  private vo = 0;
  private amounts: Float64Array;
  /** K_ion/K_neutral of components that state their own ion offset; the last solvent offset and its power. */
  private ownIonFactor: Float64Array;
  /** K_N·V_org/V_aq and K_ion·V_org/V_aq of the charged components in this contact, as the balance reads them. */
  private kNeutralRatio: Float64Array;
  private kIonRatio: Float64Array;
  private lastOffset = Number.NaN;
  private lastOffsetFactor = Number.NaN;
  /** Ion-pair δ of each solvent for organic anions and cations (ion-pair.ts), and per contact the strong cations
   * and anions of the aqueous layer, mol/L. */
  private readonly pairAnion: Float64Array;
  private readonly pairCation: Float64Array;
  /** The library's δ values before any shift (uncertainty draws shift them; setIonPairShift). */
  private readonly basePairAnion: Float64Array;
  private readonly basePairCation: Float64Array;
  private cationM = 0;
  private anionM = 0;
  /** CO₂ the water holds under 1 atm CO₂ at the contact's temperature, mol/L (setTemperature), and the
   * temperature it was set for. */
  private co2Saturation = co2SaturationM(Number.NaN);
  private temperatureC = Number.NaN;
  /** H₂CO₃* the aqueous layer holds under the headspace, mol/L: CO₂ above it leaves (Infinity: none leaves). */
  private carbonateCap = Number.POSITIVE_INFINITY;
  /** Ionic strength of the aqueous layer from every ion at the solved pH, mol/L (activity.ts). */
  ionicStrength = 0;
  /** The same at the pH of the last residualAt() call, with the activity coefficients it used. */
  private residualIonicStrength = 0;
  /** Its derivative in pH (γ held), and that pH. */
  private residualIonicSlope = 0;
  private lastEvaluatedPh = Number.NaN;
  /** Where refine() stopped without a root, and the residual there if evaluated with the γ now set (else NaN). */
  private stopPh = Number.NaN;
  private stopH = Number.NaN;
  private stopResidual = Number.NaN;
  /** −log γ± the activity coefficients were last set for (daviesTerm); 1/γ± of singly charged ions; the systems'
   * concentration constants K′ at that ionic strength. */
  private activityTerm = 0;
  /** The Davies term applyPendingActivity() sets. */
  private pendingTerm = 0;
  private invGamma1 = 1;
  /** γ± of singly charged ions (1/invGamma1): a base's K′ = K·γ±. */
  private gamma1 = 1;
  private readonly sysKa: Float64Array[] = SYSTEM_KA.map((k) => Float64Array.from(k));
  /** The last log K of each component and its power of ten, and the last ion-pair δ values and theirs. */
  private lastLogK: Float64Array;
  private lastK: Float64Array;
  private lastDAnion = Number.NaN;
  private lastDCation = Number.NaN;
  private exAnion = Number.NaN;
  private exCation = Number.NaN;
  /** Components with an acidic or basic site, and how many. */
  private charged: Int32Array;
  private nCharged = 0;

  constructor(private readonly lib: CompiledLibrary, private readonly comps: CompiledComponents) {
    this.phases = new PhaseSplit(lib);
    this.comps = comps;
    const n = comps.count;
    this.kNeutral = new Float64Array(n);
    this.kIon = new Float64Array(n);
    this.distribution = new Float64Array(n);
    this.fractionNeutral = new Float64Array(n);
    this.fractionAqueous = new Float64Array(n);
    this.amounts = new Float64Array(n);
    this.charged = new Int32Array(n);
    this.ownIonFactor = new Float64Array(n);
    this.kNeutralRatio = new Float64Array(n);
    this.kIonRatio = new Float64Array(n);
    this.amountConc = new Float64Array(n);
    this.lastLogK = new Float64Array(n).fill(Number.NaN);
    this.lastK = new Float64Array(n);
    this.basePairAnion = Float64Array.from(lib.solvents, (s) => ionPairOffset(s).anion);
    this.basePairCation = Float64Array.from(lib.solvents, (s) => ionPairOffset(s).cation);
    this.pairAnion = this.basePairAnion.slice();
    this.pairCation = this.basePairCation.slice();
  }

  /** 10^x, remembered for the last x: contacts mostly share the organic layer's ion offset. */
  private tenTo(x: number): number {
    if (x !== this.lastOffset) {
      this.lastOffset = x;
      this.lastOffsetFactor = Math.exp(x * Math.LN10);
    }
    return this.lastOffsetFactor;
  }

  /** Sets the contact temperature (°C) for the CO₂ solubility (Henry's law with its temperature dependence). */
  setTemperature(temperatureC: number): void {
    if (temperatureC === this.temperatureC) return;
    this.temperatureC = temperatureC;
    this.co2Saturation = co2SaturationM(temperatureC);
  }

  /** Shifts every solvent's ion-pair δ (anion and cation alike) by `shift[i]` log units (library solvent order). */
  setIonPairShift(shift: Float64Array): void {
    for (let i = 0; i < this.pairAnion.length; i++) {
      const d = shift[i] ?? 0;
      this.pairAnion[i] = (this.basePairAnion[i] as number) + d;
      this.pairCation[i] = (this.basePairCation[i] as number) + d;
    }
  }

  /** Call after the components' constants change: lists the components that can carry a charge. */
  componentsChanged(): void {
    const { comps } = this;
    this.nCharged = 0;
    for (let c = 0; c < comps.count; c++) {
      const own = comps.ionOffset[c] as number;
      this.ownIonFactor[c] = Number.isNaN(own) ? Number.NaN : Math.exp(own * Math.LN10);
      if ((comps.acidKa[c] as Float64Array).length + (comps.baseKa[c] as Float64Array).length > 0) this.charged[this.nCharged++] = c;
    }
  }

  /**
   * Equilibrates `mix` and writes the two layers into `org` and `aq`, which must be empty streams. The pH search
   * starts from `memo` when it holds this contact's pH from an earlier run, else from the mixture's last pH if it
   * has one, else from the last solved pH, and the memo keeps this run's pH. Kept from the first run (the input's
   * own numbers, in a Monte-Carlo run), a draw's start lies about √2 times nearer its root than the previous
   * draw's pH would, and no draw's result depends on the draw before it. `aqueousRead` false: nobody reads the
   * aqueous layer (a lean run discarding it), which is then left empty.
   */
  equilibrate(mix: Stream, org: Stream, aq: Stream, memo: PhMemo | null = null, aqueousRead = true): void {
    const { phases, comps } = this;
    const aqueous = this.prepare(mix);
    copyInto(org.solv, phases.org);
    if (aqueousRead) copyInto(aq.solv, phases.aq);
    this.co2Mmol = 0;
    if (!aqueous) {
      copyInto(org.comp, mix.comp);
      this.pH = NaN;
      this.fractionAqueous.fill(0);
      this.fractionNeutral.fill(1);
      this.distribution.fill(Infinity);
      return;
    }
    // CO₂ leaves to the headspace until H₂CO₃* is at saturation: the balance is solved with the carbonate that
    // stays dissolved at each trial pH (open system), so the gas and the pH come out of one solve.
    const carb = this.systemsPresent ? (this.systemTotals[CARBONATE] as number) : 0;
    this.carbonateCap = carb > 0 ? this.co2Saturation : Number.POSITIVE_INFINITY;
    const remembered = memo !== null && Number.isFinite(memo.pH);
    this.setActivity(remembered && Number.isFinite(memo.ionicStrength) ? memo.ionicStrength : this.ionicStrengthEstimate(mix));
    this.pH = remembered ? this.solveWithActivity(memo.pH, memo.h, true)
      : this.solveWithActivity(Number.isFinite(mix.lastPh) ? mix.lastPh : this.lastSolved, Number.NaN, false);
    if (memo && !remembered) { memo.pH = this.pH; memo.h = this.rootH; memo.ionicStrength = this.ionicStrength; }
    this.carbonateCap = Number.POSITIVE_INFINITY;
    if (carb > 0) {
      const kept = Math.min(carb, (this.co2Saturation * this.va) * this.systemSum(CARBONATE, 1 / this.rootH));
      const excess = carb - kept;
      if (excess > 1e-12) {
        this.co2Mmol = excess;
        this.systemTotals[CARBONATE] = kept;
        this.systemConc[CARBONATE] = kept / this.va;
      }
    }
    this.speciate(this.rootH);
    this.lastSolved = this.pH;
    if (!aqueousRead) {
      for (let c = 0; c < comps.count; c++) {
        const n = mix.comp[c] as number;
        org.comp[c] = n - n * (this.fractionAqueous[c] as number);
      }
      return;
    }
    if (this.systemsPresent) aq.addSystems(this.systemTotals, 1);
    aq.strongCharge = mix.strongCharge;
    aq.strongZ2 = mix.strongZ2;
    aq.osmoles = mix.osmoles;
    aq.extraMassG = mix.extraMassG;
    aq.lastPh = this.pH;
    for (let c = 0; c < comps.count; c++) {
      const n = mix.comp[c] as number;
      const a = n * (this.fractionAqueous[c] as number);
      aq.comp[c] = a;
      org.comp[c] = n - a;
    }
  }

  /**
   * pH of the prepared contact with the activity coefficients of the ionic strength at that pH (a fixed point: I
   * depends on the pH and, slightly, on γ). A bracketed Newton search with γ held finds the root to a few
   * hundredths; from there each Newton step also resets γ to the ionic strength expected at the next pH (the
   * residual computes I and its slope in the same pass), so the pH and γ settle together: three to five
   * evaluations a contact where solving to 1e-10 and re-solving after each γ update took six to eleven. A start
   * `nearRoot` (this contact's pH in an earlier run) goes straight to the joint steps. Same fixed point and
   * tolerances as that scheme, which stays as the fallback should a step leave the Newton basin.
   */
  private solveWithActivity(guess: number, guessH: number, nearRoot: boolean): number {
    let x = guess, h = guessH, known = Number.NaN;
    if (nearRoot) {
      this.refineFrom(x, h > 0 ? h : Math.exp(-x * Math.LN10), Number.NaN);
      const root = this.refined;
      if (!Number.isNaN(root)) return root;
      x = this.stopPh; h = this.stopH; known = this.stopResidual;
    }
    x = solvePhWithSlope(this, x, h, JOINT_ENTRY_STEP, known);
    h = this.rootH;
    if (x > PH_MIN && x < PH_MAX) {
      // The search's last evaluation lies one step short of x: γ from the ionic strength expected at x.
      this.refineFrom(x, h, this.residualIonicStrength + this.residualIonicSlope * (x - this.lastEvaluatedPh));
      const root = this.refined;
      if (!Number.isNaN(root)) return root;
      x = this.stopPh; h = this.stopH; known = this.stopResidual;
    } else known = Number.NaN;
    // Solved to 1e-10 with γ held, then again after each γ update until they agree (each round gains one to two
    // digits; tight, so that where the search started does not show in the result).
    x = solvePhWithSlope(this, x, h, NEWTON_STEP_TOLERANCE, known);
    for (let round = 0; round < 10; round++) {
      const i = this.ionicStrengthAt(this.rootH);
      this.ionicStrength = i;
      if (Math.abs(daviesTerm(i) - this.activityTerm) < ACTIVITY_TOLERANCE) break;
      this.setActivity(i);
      x = solvePhWithSlope(this, x, this.rootH);
    }
    return x;
  }

  /**
   * Joint Newton steps on pH and γ from pH x (h = 10^−x), γ first reset for ionic strength `next` (NaN: kept).
   * The root, or NaN when a step grows past JOINT_MAX_STEP or leaves the range (stopPh/stopH: where it stopped),
   * left in `refined`.
   */
  private refineFrom(x: number, h: number, next: number): void {
    this.refineX = x;
    this.refineH = h;
    this.refineNext = next;
    this.refine();
  }

  /** refineFrom on the start in the fields: a number passed to or returned from a call that is not inlined is
   * boxed, as is a loop variable that starts as a parameter, and these steps run some thirty times a draw. */
  private refine(): void {
    let x = this.refineX, h = this.refineH, next = this.refineNext;
    let nextTerm = Number.isNaN(next) ? Number.NaN : daviesTerm(next);
    this.refined = Number.NaN;
    for (let iter = 0; iter < MAX_JOINT_STEPS; iter++) {
      if (!Number.isNaN(nextTerm) && Math.abs(nextTerm - this.activityTerm) >= ACTIVITY_TOLERANCE) {
        this.pendingTerm = nextTerm;
        this.applyPendingActivity(true);
      }
      this.evalPh = x;
      this.evalH = h;
      this.evaluate();
      const f = this.residual;
      const i = Math.max(0, this.residualIonicStrength);
      // daviesTerm(i), and below its slope in I, from one square root.
      const r = Math.sqrt(i);
      const termI = DAVIES_A * (r / (1 + r) - 0.3 * i);
      const settled = Math.abs(termI - this.activityTerm) < ACTIVITY_TOLERANCE;
      const step = this.slope < 0 ? -f / this.slope : Number.NaN;
      if (!(Math.abs(step) < JOINT_MAX_STEP)) { this.stopResidual = f; break; }
      if (settled && Math.abs(step) < NEWTON_STEP_TOLERANCE) {
        const root = x + step;
        if (!(root > PH_MIN && root < PH_MAX)) { this.stopResidual = f; break; }
        this.ionicStrength = i;
        // A step under the Newton tolerance: the series' first terms carry 10^−x to 10^−root.
        const u = -step * Math.LN10;
        this.rootH = h * (1 + u * (1 + u * (E2 + u * (E3 + u * (E4 + u * E5)))));
        this.refined = root;
        return;
      }
      const dI = this.residualIonicSlope * step;
      next = i + dI;
      // γ for the next pH: the Davies term at I + ΔI, to first order once ΔI is below 1e-5·I (the second-order
      // part is then far under the 1e-9 tolerance; the settled test above always takes the exact term).
      nextTerm = r > 0 && Math.abs(dI) < 1e-5 * i ? termI + DAVIES_A * (0.5 / (r * (1 + r) * (1 + r)) - 0.3) * dI : daviesTerm(next);
      x += step;
      const u = -step * Math.LN10;
      const au = Math.abs(u);
      h = au <= 0.005 ? h * (1 + u * (1 + u * (E2 + u * (E3 + u * (E4 + u * E5)))))
        : au <= 0.05 ? h * (1 + u * (1 + u * (E2 + u * (E3 + u * (E4 + u * (E5 + u * (E6 + u * (E7 + u * E8))))))))
          : Math.exp(-x * Math.LN10);
      this.stopResidual = Number.NaN;
    }
    this.stopPh = x;
    this.stopH = h;
  }

  /**
   * Net positive charge (mmol) of the aqueous layer of `mix` held at `pH`, no CO₂ leaving: positive when the
   * mixture's own pH lies above `pH`, negative below (the balance falls with pH). NaN without an aqueous layer.
   * Nearly linear in an added volume of acid or base, unlike the pH.
   */
  chargeAt(mix: Stream, pH: number): number {
    if (!this.prepare(mix)) return Number.NaN;
    const a = Math.exp(-pH * Math.LN10);
    this.setActivity(this.ionicStrengthEstimate(mix));
    for (let round = 0; round < 10; round++) {
      const i = this.ionicStrengthAt(a);
      if (Math.abs(daviesTerm(i) - this.activityTerm) < ACTIVITY_TOLERANCE) break;
      this.setActivity(i);
    }
    return this.residualAt(pH, a) * this.va;
  }

  /** Ionic strength before the pH is known: strong ions with the H⁺, OH⁻ or system ions balancing their net
   * charge counted as singly charged, mol/L. */
  private ionicStrengthEstimate(mix: Stream): number {
    return (0.5 * (mix.strongZ2 + Math.abs(mix.strongCharge))) / this.va;
  }

  /** Sets the activity coefficients (Davies) and the concentration constants for ionic strength `i`. */
  private setActivity(i: number): void {
    this.pendingTerm = daviesTerm(i);
    this.applyPendingActivity(false);
  }

  /** setActivity for the Davies term in `pendingTerm` (a field, not an argument: see evaluate()); `step`: a joint
   * step's small change, for which 1/γ± is rescaled by the series above rather than computed afresh. */
  private applyPendingActivity(step: boolean): void {
    const term = this.pendingTerm;
    const u = (term - this.activityTerm) * Math.LN10;
    const au = Math.abs(u);
    const g = step && au <= 0.005 ? this.invGamma1 * (1 + u * (1 + u * (E2 + u * (E3 + u * (E4 + u * E5)))))
      : step && au <= 0.05 ? this.invGamma1 * (1 + u * (1 + u * (E2 + u * (E3 + u * (E4 + u * (E5 + u * (E6 + u * (E7 + u * E8))))))))
        : Math.exp(term * Math.LN10);
    this.activityTerm = term;
    this.invGamma1 = g;
    this.gamma1 = 1 / g;
    const g2 = g * g;
    for (let k = 0; k < this.nActive; k++) {
      const sIdx = this.active[k] as number;
      const ka = SYSTEM_KA[sIdx] as Float64Array;
      const out = this.sysKa[sIdx] as Float64Array;
      // K′/K = (1/γ±)^(1 − 2z) for a species of charge z = z₀ − j (activity.ts), by repeated products.
      const power = 1 - 2 * (SYSTEM_Z0[sIdx] as number);
      const base = power >= 0 ? g : 1 / g;
      let factor = 1;
      for (let j = Math.abs(power); j > 0; j--) factor *= base;
      for (let j = 0; j < ka.length; j++) { out[j] = (ka[j] as number) * factor; factor *= g2; }
    }
  }

  /** Σ of the system's species over its fully protonated form at 1/[H⁺] = hInv (concentration constants). */
  private systemSum(sIdx: number, hInv: number): number {
    const ka = this.sysKa[sIdx] as Float64Array;
    let term = 1, sum = 1;
    for (let j = 0; j < ka.length; j++) { term *= (ka[j] as number) * hInv; sum += term; }
    return sum;
  }

  /**
   * I = ½Σc·z² at a(H⁺) = h: strong ions, H⁺ and OH⁻, every species of the acid–base systems, and the charged
   * sites of the mixture's components in the water (each site counted as a singly charged ion).
   */
  private ionicStrengthAt(h: number): number {
    const g = this.invGamma1;
    let sum = this.strongZ2Conc + h * g + (KW / h) * g;
    const hInv = 1 / h;
    for (let k = 0; k < this.nActive; k++) {
      const sIdx = this.active[k] as number;
      const ka = this.sysKa[sIdx] as Float64Array;
      let z = SYSTEM_Z0[sIdx] as number;
      let term = 1, total = 1, z2 = z * z;
      for (let j = 0; j < ka.length; j++) {
        term *= (ka[j] as number) * hInv;
        total += term;
        z -= 1;
        z2 += term * z * z;
      }
      sum += (this.systemConc[sIdx] as number) * (z2 / total);
    }
    const { comps, voOverVa } = this;
    for (let k = 0; k < this.nCharged; k++) {
      const c = this.charged[k] as number;
      const nc = this.amountConc[c] as number;
      if (!(nc > 0)) continue;
      const acid = comps.acidKa[c] as Float64Array;
      const base = comps.baseKa[c] as Float64Array;
      let f0 = 1, charged = 0;
      for (let j = 0; j < acid.length; j++) { const ka = (acid[j] as number) * g; const x = ka / (h + ka); f0 *= 1 - x; charged += x; }
      for (let j = 0; j < base.length; j++) { const ka = (base[j] as number) / g; const x = h / (h + ka); f0 *= 1 - x; charged += x; }
      if (comps.fixedCharge[c] !== 0) { f0 = 0; charged = Math.max(charged, Math.abs(comps.fixedCharge[c] as number)); }
      const kN = this.kNeutral[c] as number, kI = this.kIon[c] as number;
      const fa = 1 / (1 + (kN * f0 + kI * (1 - f0)) * voOverVa);
      sum += nc * fa * charged;
    }
    return 0.5 * sum;
  }

  /** Phase split, partition constants and the concentrations the charge balance reads; false without water. */
  private prepare(mix: Stream): boolean {
    const { phases } = this;
    const systems = mix.hasSystems;
    let sysZ2 = 0;
    if (systems) for (let s = 0; s < N_SYSTEMS; s++) sysZ2 += (mix.sys[s] as number) * (SYSTEM_Z2_WEIGHT[s] as number);
    phases.split(mix, sysZ2);
    this.va = phases.hasAqueous ? phases.aqueousVolume : 0;
    this.vo = phases.hasOrganic && phases.hasAqueous ? phases.organicVolume : 0;
    copyInto(this.amounts, mix.comp);
    if (!phases.hasAqueous) return false;
    // Strong ions are monovalent but for thiosulfate: n± = (Σz²n ± Σzn)/2.
    this.cationM = Math.max(0, 0.5 * (mix.strongZ2 + mix.strongCharge)) / this.va;
    this.anionM = Math.max(0, 0.5 * (mix.strongZ2 - mix.strongCharge)) / this.va;
    this.setPartition();
    this.systemsPresent = systems;
    this.nActive = 0;
    if (systems) {
      copyInto(this.systemTotals, mix.sys);
      for (let sIdx = 0; sIdx < N_SYSTEMS; sIdx++) {
        const total = mix.sys[sIdx] as number;
        if (total > 0) {
          this.active[this.nActive++] = sIdx;
          this.systemConc[sIdx] = total / this.va;
        }
      }
    }
    this.strongConc = mix.strongCharge / this.va;
    this.strongZ2Conc = mix.strongZ2 / this.va;
    for (let k = 0; k < this.nCharged; k++) {
      const c = this.charged[k] as number;
      this.amountConc[c] = (this.amounts[c] as number) / this.va;
    }
    this.voOverVa = this.vo / this.va;
    for (let k = 0; k < this.nCharged; k++) {
      const c = this.charged[k] as number;
      this.kNeutralRatio[c] = (this.kNeutral[c] as number) * this.voOverVa;
      this.kIonRatio[c] = (this.kIon[c] as number) * this.voOverVa;
    }
    return true;
  }

  /**
   * log K of every component's neutral form in the organic layer, and K_ion = K_ex·[counter-ion]: the solvents'
   * ion-pair δ (weighted as the log K are) times the strong counter-ions of the water, plus a weighed salt's
   * own counter-ion where it pairs better than the reference ion. A component's own ion offset, or the legacy
   * "lipophilic" flag, gives a fixed K_ion/K_N instead.
   */
  private setPartition(): void {
    const { phases, lib, comps } = this;
    const ns = lib.solventKeys.length;
    const imm = phases.immiscibleVolume;
    const fc = phases.cosolventFraction;
    let dAnion = 0, dCation = 0, dLegacy = 0;
    for (let i = 1; i < ns && imm > 0; i++) {
      const v = phases.org[i] as number;
      if (v <= 0 || lib.miscible[i]) continue;
      const w = v / imm;
      dAnion += w * (this.pairAnion[i] as number);
      dCation += w * (this.pairCation[i] as number);
      dLegacy += w * (lib.solvents[i]?.ionPairCapable ? (lib.ionPairLogKOffset[i] as number) : (lib.ionLogKOffset[i] as number));
    }
    // K_ex at the reference counter-ion, per mol/L; `unpaired` marks a layer with no immiscible solvent.
    const unpaired = !(imm > 0);
    if (dAnion !== this.lastDAnion || dCation !== this.lastDCation) {
      this.lastDAnion = dAnion;
      this.lastDCation = dCation;
      this.exAnion = Math.exp(dAnion * Math.LN10);
      this.exCation = Math.exp(dCation * Math.LN10);
    }
    const exAnion = unpaired ? 0 : this.exAnion;
    const exCation = unpaired ? 0 : this.exCation;
    const perOwnIon = 1 / this.va;
    for (let c = 0; c < comps.count; c++) {
      let logK = 0;
      if (imm > 0) {
        for (let i = 1; i < ns; i++) {
          const v = phases.org[i] as number;
          if (v <= 0 || lib.miscible[i]) continue;
          const k = comps.logK[c * ns + i] as number;
          logK += (v / imm) * (Number.isNaN(k) ? 0 : k);
        }
      }
      // Salting out (Setschenow) moves the neutral form only: measured ion-pair extraction rises as [counter-ion]¹
      // with no further salt term (slope 1.00, Avdeef 2003), so the pair is built on the unsalted constant.
      const salting = saltingOutShift(comps.setschenow[c] as number, phases.saltM);
      if (fc > 0) {
        for (let j = 1; j < ns; j++) {
          const v = phases.aq[j] as number;
          if (v > 0 && lib.miscible[j]) logK -= (comps.sigma[c * ns + j] as number) * (v / phases.aqueousVolume);
        }
      }
      const own = comps.ionOffset[c] as number;
      // Contacts with the same organic solvent share log K: 10^log K is kept from the last contact.
      if (logK !== this.lastLogK[c]) {
        this.lastLogK[c] = logK;
        this.lastK[c] = Math.exp(logK * Math.LN10);
      }
      const kUnsalted = this.lastK[c] as number;
      const kNeutral = salting === 0 ? kUnsalted : kUnsalted * Math.exp(salting * Math.LN10);
      this.kNeutral[c] = kNeutral;
      let ionFactor: number;
      if (Number.isNaN(own) && comps.pairConstants[c] === 1) {
        this.kIon[c] = unpaired ? 0 : this.pairedIonRatio(c);
        continue;
      }
      if (!Number.isNaN(own)) ionFactor = this.ownIonFactor[c] as number;
      else if (comps.lipophilicCounterIon[c] === 1) ionFactor = this.tenTo(dLegacy);
      else {
        const anion = comps.pairsAsAnion[c] === 1;
        const ownM = (comps.ownPairing[c] as number) * (this.amounts[c] as number) * perOwnIon;
        ionFactor = anion ? exAnion * (this.cationM + ownM) : exCation * (this.anionM + ownM);
      }
      this.kIon[c] = kUnsalted * ionFactor;
    }
  }

  /**
   * Distribution ratio of the charged form of component c from its own extraction constants (components.ts),
   * the solvent's class value standing in for a solvent it has none for; mixed solvents by the log-linear rule.
   * With K_ref and K_own the constants with the water's reference counter-ions (pool P, mol/L) and with its own
   * salt ion, D = K_ref·P + K_own·[X⁻]. A permanent ion brings its own counter-ion into the water with it (not in
   * the strong-ion pool), and what pairs into the organic layer takes that ion along, so with n mmol of the ion
   * and p·n of its counter-ion in V_aq and V_org mL the free ion q and free counter-ion x (mol/L) solve
   *   n = q·V_aq + q·V_org·(K_own·x + K_ref·P),   p·n = x·(V_aq + K_own·q·V_org),
   * a quadratic in q (mass action with depletion: a more concentrated salt extracts a larger share). An acid's or
   * base's salt ion is already in the pool: D = K_ref·P + (K_own − K_ref)·[X⁻]own.
   */
  private pairedIonRatio(c: number): number {
    const { phases, lib, comps } = this;
    const ns = lib.solventKeys.length;
    const imm = phases.immiscibleVolume;
    const anion = comps.pairsAsAnion[c] === 1;
    const ownLog = comps.ownPairingLog[c] as number;
    let logRef = 0, logOwn = 0;
    for (let i = 1; i < ns; i++) {
      const v = phases.org[i] as number;
      if (v <= 0 || lib.miscible[i]) continue;
      const w = v / imm;
      const k = comps.logK[c * ns + i] as number;
      const measured = comps.pairRef[c * ns + i] as number;
      const ref = Number.isNaN(measured) ? (Number.isNaN(k) ? 0 : k) + ((anion ? this.pairAnion[i] : this.pairCation[i]) as number) : measured;
      const ownMeasured = comps.pairOwn[c * ns + i] as number;
      logRef += w * ref;
      logOwn += w * (Number.isNaN(ownMeasured) ? ref + ownLog : ownMeasured);
    }
    const kRef = Math.exp(logRef * Math.LN10);
    const kOwn = Math.exp(logOwn * Math.LN10);
    const pool = anion ? this.cationM : this.anionM;
    const perParent = comps.saltPerParent[c] as number;
    const n = this.amounts[c] as number;
    const va = this.va, vo = this.vo;
    if (!(perParent > 0)) return kRef * pool;
    if (comps.fixedCharge[c] === 0) return kRef * pool + (kOwn - kRef) * (perParent * n) / va;
    const m = perParent * n;
    if (!(n > 0) || !(vo > 0)) return kRef * pool + (kOwn * m) / va;
    const a = va + vo * kRef * pool;
    const e = kOwn * vo;
    const b = a * va + e * (m - n);
    const root = Math.sqrt(b * b + 4 * a * e * n * va);
    const q = b >= 0 ? (2 * n * va) / (b + root) : (root - b) / (2 * a * e);
    return (n - q * va) / (q * vo);
  }

  /**
   * Net positive charge (mol/L) in the aqueous layer at this pH, with components distributed between layers;
   * sets `slope` to its derivative in pH (a sum of negative terms: −ln10 times the buffer capacities).
   */
  residualAt(pH: number, a: number): number {
    this.evalPh = pH;
    this.evalH = a;
    this.evaluate();
    return this.residual;
  }

  /**
   * residualAt on the pH and a(H⁺) in `evalPh` and `evalH`, the result in `residual`: the joint steps call it so,
   * since a call that passes or returns a number allocates a box for it unless the call is inlined, and this
   * one is too large to be (a Monte-Carlo draw allocated some kilobytes of such boxes).
   */
  private evaluate(): void {
    solverStats.evaluations++;
    const pH = this.evalPh;
    this.lastEvaluatedPh = pH;
    // `a` is a(H⁺); with concentration constants (setActivity) the balance runs on [H⁺] = a/γ±, and sites on
    // h = a (acids: K′ = K/γ±; bases: K′ = K·γ±, so x = a/(a + K′·…) keeps the same form).
    const g = this.invGamma1;
    const gamma = this.gamma1;
    const h = this.evalH;
    const hInv = 1 / h;
    const hc = h * g;
    const oh = KW * hInv * g;
    let f = this.strongConc + hc - oh;
    let df = hc + oh;
    // Σc·z² for the ionic strength, as ionicStrengthAt counts it (systems uncapped, each charged site as ±1).
    let cz2 = this.strongZ2Conc + hc + oh;
    // d(Σc·z²)/d pH over ln10.
    let dcz2 = oh - hc;
    for (let k = 0; k < this.nActive; k++) {
      const s = this.active[k] as number;
      const ka = this.sysKa[s] as Float64Array;
      let term = 1, sum = 1, lost = 0, lost2 = 0, lost3 = 0;
      for (let i = 0; i < ka.length; i++) {
        term *= (ka[i] as number) * hInv;
        sum += term;
        const j = i + 1;
        lost += j * term;
        lost2 += j * j * term;
        lost3 += j * j * j * term;
      }
      const conc = this.systemConc[s] as number;
      const z0 = SYSTEM_Z0[s] as number;
      const mean = lost / sum;
      // Σ term_j·(z₀ − j)² over Σ term_j = z₀² − 2z₀·mean + lost2/sum.
      const m2 = lost2 / sum;
      cz2 += conc * (z0 * z0 - 2 * z0 * mean + m2);
      // Moments of j move with ln(1/h): d mean = m2 − mean², d m2 = m3 − m2·mean.
      dcz2 += conc * (-2 * z0 * (m2 - mean * mean) + lost3 / sum - m2 * mean);
      if (s === CARBONATE && conc > this.carbonateCap * sum) {
        // Capped at saturation: [H₂CO₃*] fixed, so [HCO₃⁻] = cap·K₁/h and [CO₃²⁻] = cap·K₁K₂/h² (z₀ = 0).
        f -= this.carbonateCap * lost;
        df += this.carbonateCap * lost2;
        continue;
      }
      f += conc * (z0 - mean);
      df += conc * (lost2 / sum - mean * mean);
    }
    const { comps } = this;
    for (let k = 0; k < this.nCharged; k++) {
      const c = this.charged[k] as number;
      const nc = this.amountConc[c] as number;
      if (!(nc > 0)) continue;
      const acid = comps.acidKa[c] as Float64Array;
      const base = comps.baseKa[c] as Float64Array;
      // Per site: charged fraction x; d x/d pH = ±ln10·x(1 − x). f₀ = Π(1 − x) moves by ln10·f₀·z.
      let f0 = 1, z = 0, dz = 0, sites = 0, dSites = 0;
      for (let i = 0; i < acid.length; i++) {
        const ka = (acid[i] as number) * g;
        const x = ka / (h + ka);
        const v = x * (1 - x);
        f0 *= 1 - x;
        z -= x;
        dz += v;
        sites += x;
        dSites += v;
      }
      for (let i = 0; i < base.length; i++) {
        const ka = (base[i] as number) * gamma;
        const x = h / (h + ka);
        const v = x * (1 - x);
        f0 *= 1 - x;
        z += x;
        dz += v;
        sites += x;
        dSites -= v;
      }
      const fixedCharge = comps.fixedCharge[c] as number;
      const fixed = fixedCharge !== 0;
      if (fixed) {
        f0 = 0;
        if (Math.abs(fixedCharge) >= sites) { sites = Math.abs(fixedCharge); dSites = 0; }
      }
      const aN = this.kNeutralRatio[c] as number, aI = this.kIonRatio[c] as number;
      const fa = 1 / (1 + aI + (aN - aI) * f0);
      f += nc * fa * z;
      // d fa/d pH = −fa²·(vo/va)·(kN − kI)·f₀·z·ln10; the ln10 is applied to the whole slope below.
      const dfa = fixed ? 0 : -fa * fa * (aN - aI) * f0 * z;
      df += nc * (fa * dz - dfa * z);
      cz2 += nc * fa * sites;
      dcz2 += nc * (fa * dSites + sites * dfa);
    }
    this.slope = -Math.LN10 * df;
    this.residualIonicStrength = 0.5 * cz2;
    this.residualIonicSlope = 0.5 * Math.LN10 * dcz2;
    this.residual = f;
  }

  /** Speciation and distribution of every component at the solved pH (a(H⁺) = h). */
  private speciate(h: number): void {
    const { comps, va, vo } = this;
    const g = this.invGamma1;
    for (let c = 0; c < comps.count; c++) {
      const acid = comps.acidKa[c] as Float64Array;
      const base = comps.baseKa[c] as Float64Array;
      let f0 = 1;
      for (let i = 0; i < acid.length; i++) {
        const ka = (acid[i] as number) * g;
        f0 *= 1 - ka / (h + ka);
      }
      for (let i = 0; i < base.length; i++) {
        const ka = (base[i] as number) / g;
        f0 *= 1 - h / (h + ka);
      }
      if (comps.fixedCharge[c] !== 0) f0 = 0;
      const d = (this.kNeutral[c] as number) * f0 + (this.kIon[c] as number) * (1 - f0);
      this.fractionNeutral[c] = f0;
      this.distribution[c] = d;
      this.fractionAqueous[c] = va / (va + d * vo);
    }
  }

  /** Free H⁺ and OH⁻ in the aqueous layer after the contact, mmol. */
  freeAcidBase(): { h: number; oh: number } {
    if (!this.phases.hasAqueous) return { h: 0, oh: 0 };
    const a = 10 ** -this.pH;
    return { h: a * this.invGamma1 * this.va, oh: (KW / a) * this.invGamma1 * this.va };
  }

  get aqueousVolume(): number { return this.va; }
  get organicVolume(): number { return this.phases.hasOrganic ? this.phases.organicVolume : 0; }
  get waterIndex(): number { return WATER; }
}
