// Sends a registration from the browser. Small inputs go through the server action; large MOL/SD files go to the
// REST route instead, because server actions accept bodies up to Next's 1 MB default and the route takes 10 MB.
// Both run the same schema and service and come back as the same ActionResult.
import { registerCompoundsAction } from "@/lib/compounds/actions";
import type { RegisterOutcome } from "@/lib/compounds/actions";
import type { RecordProblem } from "@/lib/compounds/import-records";
import type { RegisterCompoundsInput } from "@/lib/compounds/schemas";
import type { ActionResult, FieldErrors } from "@/lib/errors";

/** Below Next's 1 MB server-action limit with room for the rest of the request. */
const ACTION_LIMIT_CHARS = 900_000;

interface RouteBody {
  created?: Extract<RegisterOutcome, { status: "registered" }>["created"];
  skipped?: RecordProblem[];
  error?: { message: string; fields?: FieldErrors; records?: RecordProblem[]; recordCount?: number };
}

export async function sendRegistration(input: RegisterCompoundsInput): Promise<ActionResult<RegisterOutcome>> {
  if (input.text.length <= ACTION_LIMIT_CHARS) return registerCompoundsAction(input);
  const response = await fetch("/api/v1/compounds", { method: "POST", headers: { "Content-Type": "application/json" }, body: JSON.stringify(input) });
  const body = (await response.json().catch(() => ({}))) as RouteBody;
  if (response.status === 201 && body.created) return { ok: true, data: { status: "registered", created: body.created, skipped: body.skipped ?? [] } };
  const error = body.error ?? { message: `The server answered ${response.status}.` };
  if (response.status === 422 && error.records) {
    return { ok: true, data: { status: "rejected", message: error.message, problems: error.records, recordCount: error.recordCount ?? error.records.length } };
  }
  return { ok: false, status: response.status, message: error.message, ...(error.fields ? { fieldErrors: error.fields } : {}) };
}
