// What a job's failure says to the group. Members and viewers all see it on the progress bar, so only messages
// written for people (AppError) are passed on; anything else (SQL, file paths, stack text) is logged under an id and
// the job says only that id.
import { AppError, logUnexpected } from "@/lib/errors";

const MAX_LENGTH = 300;

export function jobFailureMessage(error: unknown, where: string): string {
  if (error instanceof AppError) return error.message.slice(0, MAX_LENGTH);
  const id = logUnexpected(error, where);
  return `an unexpected error (logged on the server as ${id})`;
}
