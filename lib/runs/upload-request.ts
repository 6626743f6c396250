import "server-only";
import { readMultipart } from "@/lib/api";
import { AppError, invalidInput } from "@/lib/errors";
import { MAX_FILE_BYTES } from "@/lib/thermal/decode";
import { isThermalFileError } from "@/lib/thermal/errors";
import { runUploadSchema, type RunUploadInput } from "@/lib/validation/runs";

export type UploadRequest = { input: RunUploadInput; file: { bytes: Uint8Array; name: string; mediaType: string } };

/** Reads a run upload (multipart `file` plus the optional fields), refusing what is malformed. */
export async function readRunUpload(req: Request): Promise<UploadRequest> {
  const form = await readMultipart(req, { maxBytes: MAX_FILE_BYTES, label: "logger file" });
  const file = form.get("file");
  if (!(file instanceof File)) throw new AppError("invalid_input", "file: attach the logger file in the form field named file.", { fields: { file: "is required" } });
  if (file.size > MAX_FILE_BYTES) throw new AppError("file_too_large", `The logger file is larger than ${MAX_FILE_BYTES / 1024 / 1024} MB.`, { maxBytes: MAX_FILE_BYTES });
  const fields: Record<string, string> = {};
  for (const [key, value] of form.entries()) if (key !== "file" && typeof value === "string") fields[key] = value;
  const parsed = runUploadSchema.safeParse(fields);
  if (!parsed.success) throw invalidInput(parsed.error.issues);
  return { input: parsed.data, file: { bytes: new Uint8Array(await file.arrayBuffer()), name: file.name, mediaType: file.type } };
}

/** An analysis option error (e.g. a column that is not there) is the caller's input, so a 400 naming the field. */
export function asInputError(err: unknown): unknown {
  if (isThermalFileError(err) && err.code === "invalid_options") {
    const field = String(err.details.field ?? "options");
    return new AppError("invalid_input", err.message, { fields: { [field]: err.message } });
  }
  return err;
}
