import { describe, expect, it } from "vitest";
import { DEFAULT_WINDOW, findWindowPreset, processWindowSchema, WINDOW_PRESETS } from "@/lib/thermal/windows";

describe("J-STD-020 classification presets", () => {
  /*
   * Source: IPC/JEDEC J-STD-020D Table 5-2 "Classification reflow profile", as reproduced in the
   * Pericom/SaRonix note "Reflow Soldering Profile, Per J-STD-020D, Table 5-2" (Rev E 07/18/12)
   * and the Diodes Inc. copy (REFERENCES §1a). Peak ranges: Tc of Table 4-2 (Pb-free 245/250/260 °C)
   * and Table 4-1 (Sn-Pb 220/235 °C, from memory, corroborated by the TDK B57820M datasheet).
   */
  it("Pb-free: Ts 150–200 °C for 60–120 s, TL 217 °C for 60–150 s, 3 °C/s up, 6 °C/s down, 8 min to peak", () => {
    const w = findWindowPreset("jstd020-pb-free")!.window;
    expect(w).toMatchObject({
      soakStart: 150, soakEnd: 200, soakMin: 60, soakMax: 120,
      liquidus: 217, talMin: 60, talMax: 150,
      rampUpMax: 3, rampDownMax: 6, timeToPeakMax: 8 * 60,
      peakMin: 245, peakMax: 260,
    });
  });

  it("Sn-Pb eutectic: Ts 100–150 °C for 60–120 s, TL 183 °C for 60–150 s, 3 °C/s up, 6 °C/s down, 6 min to peak", () => {
    const w = findWindowPreset("jstd020-snpb")!.window;
    expect(w).toMatchObject({
      soakStart: 100, soakEnd: 150, soakMin: 60, soakMax: 120,
      liquidus: 183, talMin: 60, talMax: 150,
      rampUpMax: 3, rampDownMax: 6, timeToPeakMax: 6 * 60,
      peakMin: 220, peakMax: 235,
    });
  });

  it("says that classification limits are component limits, not a paste recipe, and names the source", () => {
    for (const id of ["jstd020-pb-free", "jstd020-snpb"]) {
      const preset = findWindowPreset(id)!;
      expect(preset.source).toContain("J-STD-020D Table 5-2");
      expect(preset.note).toMatch(/component limits/);
      expect(preset.note).toMatch(/not a paste recipe/);
    }
  });
});

describe("typical paste windows", () => {
  it("SAC305: Tuya CB3S datasheet p. 23 values (REFERENCES §1c)", () => {
    // Liquidus 217 °C; ramp ≤ 3 °C/s; soak 150–200 °C for 60–120 s; TAL 50–70 s; peak 235–245 °C; ramp-down ≤ 4 °C/s.
    const preset = findWindowPreset("sac305-typical")!;
    expect(preset.window).toMatchObject({
      liquidus: 217, rampUpMax: 3, soakStart: 150, soakEnd: 200, soakMin: 60, soakMax: 120,
      talMin: 50, talMax: 70, peakMin: 235, peakMax: 245, rampDownMax: 4,
    });
    expect(preset.source).toContain("Tuya CB3S");
    // deltaTMax 10 °C: common practice, no source. Time to peak: J-STD-020 Pb-free, 8 min.
    expect(preset.window.deltaTMax).toBe(10);
    expect(preset.window.timeToPeakMax).toBe(480);
  });

  it("Sn63Pb37: Ebyte E18 user manual §8.1 values (REFERENCES §1c)", () => {
    // Preheat 100–150 °C for 60–120 s; TL 183 °C; TAL 60–90 s; peak 220–235 °C; ramp ≤ 3; down ≤ 6; ≤ 6 min to peak.
    const preset = findWindowPreset("sn63pb37-typical")!;
    expect(preset.window).toMatchObject({
      soakStart: 100, soakEnd: 150, soakMin: 60, soakMax: 120, liquidus: 183,
      talMin: 60, talMax: 90, peakMin: 220, peakMax: 235, rampUpMax: 3, rampDownMax: 6, timeToPeakMax: 360,
    });
    expect(preset.source).toContain("Ebyte E18");
  });

  it("uses our documented defaults where the sources are silent, and SAC305 as the default window", () => {
    for (const preset of WINDOW_PRESETS) {
      expect(preset.window).toMatchObject({ rampWindow: 10, heatUpFrom: 50, heatUpTo: 150 });
      expect(preset.note).toContain("rampWindow 10 s");
      expect(processWindowSchema.safeParse(preset.window).success).toBe(true);
    }
    expect(DEFAULT_WINDOW).toBe(findWindowPreset("sac305-typical")!.window);
    expect(new Set(WINDOW_PRESETS.map((p) => p.id)).size).toBe(WINDOW_PRESETS.length);
  });
});

describe("processWindowSchema cross-field checks", () => {
  const cases: Array<[string, Record<string, number>, string]> = [
    ["peakMax", { peakMin: 250, peakMax: 245 }, "peakMax (245 °C) must be greater than peakMin (250 °C)."],
    ["talMax", { talMin: 80, talMax: 70 }, "talMax (70 s) must be greater than talMin (80 s)."],
    ["soakEnd", { soakStart: 200, soakEnd: 150 }, "soakEnd (150 °C) must be greater than soakStart (200 °C)."],
    ["soakMax", { soakMin: 120, soakMax: 60 }, "soakMax (60 s) must be greater than soakMin (120 s)."],
    ["heatUpTo", { heatUpFrom: 150, heatUpTo: 150 }, "heatUpTo (150 °C) must be greater than heatUpFrom (150 °C)."],
    ["peakMin", { liquidus: 240 }, "peakMin (235 °C) must be greater than liquidus (240 °C)."],
  ];
  it.each(cases)("names %s", (field, change, message) => {
    const result = processWindowSchema.safeParse({ ...DEFAULT_WINDOW, ...change });
    expect(result.success).toBe(false);
    expect(result.error!.issues).toContainEqual(expect.objectContaining({ path: [field], message }));
  });

  it("names a field of the wrong type or out of range", () => {
    const wrongType = processWindowSchema.safeParse({ ...DEFAULT_WINDOW, rampUpMax: "fast" });
    expect(wrongType.error!.issues[0]).toMatchObject({ path: ["rampUpMax"], message: "rampUpMax must be a number (°C/s)." });
    const zero = processWindowSchema.safeParse({ ...DEFAULT_WINDOW, rampWindow: 0 });
    expect(zero.error!.issues[0]).toMatchObject({ path: ["rampWindow"], message: "rampWindow must be greater than 0 s." });
    const missing = processWindowSchema.safeParse({ ...DEFAULT_WINDOW, liquidus: undefined });
    expect(missing.error!.issues[0].path).toEqual(["liquidus"]);
    expect(processWindowSchema.safeParse({ ...DEFAULT_WINDOW, criticalSpreadMax: 8 }).success).toBe(true);
  });
});
