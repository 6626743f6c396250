import { readFileUpload, withApi } from "@/lib/api";
import { analyzeLoggerFile } from "@/lib/thermal/analyze";
import { toAnalyzeOptions } from "@/lib/thermal/options";
import { MAX_FILE_BYTES } from "@/lib/thermal/decode";
import type { AnalysisResult } from "@/lib/thermal/types";
import { asInputError } from "@/lib/runs/upload-request";

export type AnalyzeResponse = AnalysisResult;

// Stateless: analyses one logger file and stores nothing. Loggers and scripts call it directly.
export const POST = withApi(
  async ({ req }) => {
    const { file, fields } = await readFileUpload(req, { maxBytes: MAX_FILE_BYTES, label: "logger file" });
    try {
      return analyzeLoggerFile({ bytes: file.bytes }, toAnalyzeOptions(fields)) satisfies AnalyzeResponse;
    } catch (err) {
      throw asInputError(err);
    }
  },
  { permission: "profile.analyze", what: "analyse logger files" },
);
