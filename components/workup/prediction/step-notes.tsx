// Safety cautions and risk flags at the step that triggers them. Cautions are prompts: they defer to the
// institution's rules and safety plan and never read as permission.
import { type Caution, type Flag } from "@/lib/chem/types";

const CAUTION_TITLES: Record<Caution["code"], string> = {
  gas_evolution: "Gas evolution: vent the funnel",
  exotherm: "Heat released",
  peroxide_former: "Peroxide-forming ether",
  chlorinated_waste: "Chlorinated waste",
  volatile_solvent_pressure: "Pressure from a volatile solvent",
  hydrogen_fluoride: "Hydrogen fluoride",
  cyanide: "Cyanide",
  azide: "Azide",
  reactive_quench: "Reactive quench",
  heavy_metal_waste: "Heavy-metal waste",
  reproductive_toxicant: "Reproductive toxicant",
};

export function cautionTitle(code: Caution["code"]): string {
  return CAUTION_TITLES[code] ?? code.replace(/_/g, " ");
}

export function CautionNotes({ cautions }: { cautions: Caution[] }) {
  if (cautions.length === 0) return null;
  return (
    <div className="space-y-1.5" data-testid="step-cautions">
      {cautions.map((c, i) => (
        <div key={`${c.code}-${i}`} role="note" aria-label={`Safety: ${cautionTitle(c.code)}`} className="rounded border-l-4 border-orange-500 bg-orange-50 px-3 py-1.5 text-xs text-orange-950">
          <p className="font-semibold">⚠ {cautionTitle(c.code)}</p>
          <p className="mt-0.5">{c.text}</p>
        </div>
      ))}
    </div>
  );
}

const SEVERITY_STYLE: Record<Flag["severity"], string> = {
  danger: "border-red-500 bg-red-50 text-red-950",
  warning: "border-amber-500 bg-amber-50 text-amber-950",
  info: "border-sky-400 bg-sky-50 text-sky-950",
};

const SEVERITY_WORD: Record<Flag["severity"], string> = { danger: "Serious", warning: "Check", info: "Note" };

export function FlagNotes({ flags, showStep = false, onStep }: { flags: Flag[]; showStep?: boolean; onStep?: (step: number) => void }) {
  if (flags.length === 0) return null;
  return (
    <div className="space-y-1.5" data-testid="flags">
      {flags.map((f, i) => (
        <div key={`${f.code}-${f.step ?? 0}-${i}`} className={`rounded border-l-4 px-3 py-1.5 text-xs ${SEVERITY_STYLE[f.severity]}`} data-flag={f.code}>
          <p className="font-semibold">
            <span className="sr-only">{SEVERITY_WORD[f.severity]}: </span>{f.title}
            {showStep && f.step !== undefined ? (
              onStep ? <button type="button" className="ml-2 font-normal underline" onClick={() => onStep(f.step as number)}>step {f.step}</button> : <span className="ml-2 font-normal">step {f.step}</span>
            ) : null}
          </p>
          <p className="mt-0.5"><span className="font-medium">Why: </span>{f.cause}</p>
          <p className="mt-0.5"><span className="font-medium">What to do: </span>{f.remedy}</p>
        </div>
      ))}
    </div>
  );
}
