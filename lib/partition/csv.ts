// The observations of one compound as CSV rows (header first), for the page's export and the API.
import { type CsvCell } from "@/components/charts/csv";
import { type ObservationRow } from "./queries";

export function observationsCsv(compoundName: string, rows: readonly ObservationRow[]): CsvCell[][] {
  return [
    ["compound", "solvent", "recorded", "kind", "bound", "log_k", "log_k_se", "aqueous_ph", "temperature_c", "method", "weight", "excluded", "outlier", "workup_id", "recorded_by", "observation_id"],
    ...rows.map((r) => [
      compoundName, r.solventKey, r.createdAt.toISOString(), r.kind, r.bound, r.logK, r.logKSe, r.aqueousPh, r.temperatureC, r.method, r.weight,
      r.excluded, r.outlier, r.workup?.id ?? null, r.createdBy, r.id,
    ]),
  ];
}
