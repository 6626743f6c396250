import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyzeLoggerFile } from "@/lib/thermal/analyze";
import { runToCsv, simulateReflowRun } from "@/lib/thermal/synthetic-profile";

/*
 * tests/fixtures/logger-files/generic-8ch.csv is invented data for e2e and API tests, written by
 *   runToCsv(simulateReflowRun({ probes: 8, sampleHz: 1, durationSeconds: 420, seed: 7 }), 1, "\r\n")
 * It is meant to be a plausible SAC305 run that passes the default window.
 */
const file = path.join(__dirname, "../../fixtures/logger-files/generic-8ch.csv");

describe("the sample logger file", () => {
  it("is reproduced byte for byte by the deterministic generator", () => {
    const again = runToCsv(simulateReflowRun({ probes: 8, sampleHz: 1, durationSeconds: 420, seed: 7 }), 1, "\r\n");
    expect(again).toBe(readFileSync(file, "utf8"));
  });

  it("holds eight probes sampled every second for seven minutes and passes the SAC305 window", () => {
    const result = analyzeLoggerFile({ bytes: new Uint8Array(readFileSync(file)) });
    expect(result.meta).toMatchObject({ channels: 8, rows: 421, sampleInterval: 1, durationSeconds: 420, units: "C", warnings: [] });
    expect(result.channels.map((c) => c.name)).toEqual(["TC1", "TC2", "TC3", "TC4", "TC5", "TC6", "TC7", "TC8"]);
    expect(result.board.peakMin).toBeGreaterThanOrEqual(235);
    expect(result.board.peakMax).toBeLessThanOrEqual(245);
    expect(result.board.deltaTPeak).toBeLessThan(10);
    expect(result.verdict.status).toBe("pass");
  });
});
