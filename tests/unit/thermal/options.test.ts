import { describe, expect, it } from "vitest";
import { ThermalFileError } from "@/lib/thermal/errors";
import { analysisOptionsSchema, toAnalyzeOptions } from "@/lib/thermal/options";
import { DEFAULT_WINDOW, findWindowPreset } from "@/lib/thermal/windows";

function fieldError(fields: Record<string, unknown>): { field: unknown; message: string } {
  try {
    toAnalyzeOptions(fields);
  } catch (error) {
    expect(error).toBeInstanceOf(ThermalFileError);
    const e = error as ThermalFileError;
    expect(e).toMatchObject({ code: "invalid_options", status: 400 });
    return { field: e.details.field, message: e.message };
  }
  throw new Error("expected the options to be refused");
}

describe("analysis options from form fields", () => {
  it("turns string fields into typed options", () => {
    const options = toAnalyzeOptions({
      window: "sn63pb37-typical",
      skewSeconds: "0,05",
      offsets: '{"TC1": -0.4, "TC2": 0.25}',
      thermocouple: "J",
      coldJunctionC: "23.5",
      units: "mV",
      setPointColumn: "Setpoint",
      columns: '["TC2","TC1"]',
    });
    expect(options).toEqual({
      window: findWindowPreset("sn63pb37-typical")!.window,
      skewSeconds: 0.05,
      offsets: { TC1: -0.4, TC2: 0.25 },
      thermocouple: "J",
      coldJunctionC: 23.5,
      units: "mV",
      setPointColumn: "Setpoint",
      columns: ["TC2", "TC1"],
    });
  });

  it("treats empty strings as absent and accepts a window as JSON or as an object", () => {
    expect(toAnalyzeOptions({ window: "", skewSeconds: " ", units: "" })).toEqual({});
    const custom = { ...DEFAULT_WINDOW, deltaTMax: 5 };
    expect(toAnalyzeOptions({ window: JSON.stringify(custom) }).window).toEqual(custom);
    expect(toAnalyzeOptions({ window: custom, skewSeconds: 0.1 })).toEqual({ window: custom, skewSeconds: 0.1 });
    expect(toAnalyzeOptions({ columns: "TC1, TC3" }).columns).toEqual(["TC1", "TC3"]);
  });

  it("names the field of every error", () => {
    expect(fieldError({ skewSeconds: "fast" })).toEqual({ field: "skewSeconds", message: "skewSeconds must be a number (s)." });
    expect(fieldError({ skewSeconds: "20" })).toEqual({ field: "skewSeconds", message: "skewSeconds must be at most 10 s." });
    expect(fieldError({ coldJunctionC: "hot" }).field).toBe("coldJunctionC");
    expect(fieldError({ thermocouple: "S" })).toEqual({ field: "thermocouple", message: "thermocouple must be K, J or T." });
    expect(fieldError({ units: "K" })).toEqual({ field: "units", message: "units must be C, F or mV." });
    expect(fieldError({ offsets: "{TC1: 1}" })).toEqual({ field: "offsets", message: "offsets is not valid JSON." });
    expect(fieldError({ offsets: '{"TC1": "hot"}' }).field).toBe("offsets");
    expect(fieldError({ columns: "[]" }).field).toBe("columns");
    expect(fieldError({ window: "no-such-window" }).message).toContain("neither a process window (JSON) nor a preset id");
    expect(fieldError({ window: "{oops" })).toEqual({ field: "window", message: "window is not valid JSON." });
  });

  it("names the window's own field when a JSON window is wrong", () => {
    const bad = { ...DEFAULT_WINDOW, peakMin: 250 };
    expect(fieldError({ window: JSON.stringify(bad) })).toEqual({
      field: "window.peakMax",
      message: "window: peakMax (245 °C) must be greater than peakMin (250 °C).",
    });
  });

  it("exposes the zod schema for forms (issues carry the field path)", () => {
    const parsed = analysisOptionsSchema.safeParse({ units: "kelvin" });
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues[0].path).toEqual(["units"]);
  });
});
