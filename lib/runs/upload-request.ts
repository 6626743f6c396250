import "server-only";
import { readFileUpload } from "@/lib/api";
import { AppError, invalidInput } from "@/lib/errors";
import { MAX_FILE_BYTES } from "@/lib/thermal/decode";
import { isThermalFileError } from "@/lib/thermal/errors";
import { runUploadSchema, type RunUploadInput } from "@/lib/validation/runs";

export type UploadRequest = { input: RunUploadInput; file: { bytes: Uint8Array; name: string; mediaType: string } };

/** Reads a run upload (multipart `file` plus the optional fields), refusing what is malformed. */
export async function readRunUpload(req: Request): Promise<UploadRequest> {
  const { file, fields } = await readFileUpload(req, { maxBytes: MAX_FILE_BYTES, label: "logger file" });
  const parsed = runUploadSchema.safeParse(fields);
  if (!parsed.success) throw invalidInput(parsed.error.issues);
  return { input: parsed.data, file };
}

/** An analysis option error (e.g. a column that is not there) is the caller's input, so a 400 naming the field. */
export function asInputError(err: unknown): unknown {
  if (isThermalFileError(err) && err.code === "invalid_options") {
    const field = String(err.details.field ?? "options");
    return new AppError("invalid_input", err.message, { fields: { [field]: err.message } });
  }
  return err;
}
