// Words the editor shows for the schema's enum values.
import { type ComponentRole, type Provenance } from "@/lib/chem/schema";

const ROLE_LABELS: Record<ComponentRole, string> = {
  product: "Product", starting_material: "Starting material", reagent: "Reagent", byproduct: "By-product",
  impurity: "Impurity", catalyst: "Catalyst", other: "Other",
};

export const roleLabel = (r: ComponentRole) => ROLE_LABELS[r];

export const PROVENANCE_LABELS: Record<Provenance, string> = {
  estimated: "Estimated", literature: "Literature", measured: "Measured", group: "Group value",
};

const OPTION_LABELS: Record<string, string> = {
  organic: "Organic layer", aqueous: "Aqueous layer", filtrate: "Filtrate", solid: "Solid",
  rotavap: "Rotary evaporator", high_vacuum: "High vacuum", n2_stream: "Nitrogen stream", distillation: "Distillation",
  normal: "Reagent into the reaction", inverse: "Reaction into the reagent (inverse)",
};

export const optionLabel = (value: string) => OPTION_LABELS[value] ?? value.replace(/_/g, " ");
