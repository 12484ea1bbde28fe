import { z } from "zod";
import { recordIdArg } from "@/lib/api/action-args";

/** Largest attachment kept: 10 MB (a phone photo of a TLC plate or a spectrum PDF fits easily). */
export const MAX_ATTACHMENT_BYTES = 10 * 1024 * 1024;
/** Largest thumbnail: 200 kB (the browser makes them at 320 px). */
export const MAX_THUMBNAIL_BYTES = 200 * 1024;


/** File names are shown and sent back in Content-Disposition: printable, no path, at most 200 characters. */
export const fileNameSchema = z
  .string({ error: "name is required" })
  .trim()
  .min(1, { error: "name is required" })
  .max(200, { error: "name must be at most 200 characters" })
  // eslint-disable-next-line no-control-regex -- control characters are exactly what this refuses
  .refine((s) => !/[\u0000-\u001f\u007f/\\]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/.test(s),
    { error: "name must not contain control characters, slashes or unpaired surrogates" });

export const uploadQuerySchema = z.object({
  name: fileNameSchema,
  target: z.enum(["workup", "outcome"], { error: () => "target must be 'workup' or 'outcome'" }).default("workup"),
}).strict();

export const attachmentParamsSchema = z.object({ id: recordIdArg("attachment id") });
export const workupParamsSchema = z.object({ id: recordIdArg("workup id") });
