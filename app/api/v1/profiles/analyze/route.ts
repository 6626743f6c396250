import { AppError } from "@/lib/errors";
import { readMultipart, withApi } from "@/lib/api";
import { analyzeLoggerFile } from "@/lib/thermal/analyze";
import { toAnalyzeOptions } from "@/lib/thermal/options";
import { isThermalFileError } from "@/lib/thermal/errors";
import { MAX_FILE_BYTES } from "@/lib/thermal/decode";
import type { AnalysisResult } from "@/lib/thermal/types";

export type AnalyzeResponse = AnalysisResult;

// Stateless: analyses one logger file and stores nothing. Loggers and scripts call it directly.
export const POST = withApi(
  async ({ req }) => {
    const form = await readMultipart(req, { maxBytes: MAX_FILE_BYTES, label: "logger file" });
    const file = form.get("file");
    if (!(file instanceof File)) throw new AppError("invalid_input", "file: attach the logger file in the form field named file.", { fields: { file: "is required" } });
    if (file.size > MAX_FILE_BYTES) throw new AppError("file_too_large", `The logger file is larger than ${MAX_FILE_BYTES / 1024 / 1024} MB.`, { maxBytes: MAX_FILE_BYTES });
    const fields: Record<string, string> = {};
    for (const [key, value] of form.entries()) if (key !== "file" && typeof value === "string") fields[key] = value;
    try {
      const options = toAnalyzeOptions(fields);
      return analyzeLoggerFile({ bytes: new Uint8Array(await file.arrayBuffer()) }, options) satisfies AnalyzeResponse;
    } catch (err) {
      if (isThermalFileError(err) && err.code === "invalid_options") {
        const field = String(err.details.field ?? "options");
        throw new AppError("invalid_input", err.message, { fields: { [field]: err.message } });
      }
      throw err;
    }
  },
  { permission: "profile.analyze", what: "analyse logger files" },
);
