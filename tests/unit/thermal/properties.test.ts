import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { analyzeLoggerFile, type AnalyzeOptions } from "@/lib/thermal/analyze";
import { firstUpCrossing } from "@/lib/thermal/curve";
import { describeColumns } from "@/lib/thermal/describe-columns";
import { ThermalFileError } from "@/lib/thermal/errors";
import { emfMillivolts } from "@/lib/thermal/its90";
import type { AnalysisResult } from "@/lib/thermal/types";
import { at, type Knot, toFahrenheit, writeFile } from "./helpers/profiles";

/*
 * Random reflow-like curves: knots at whole seconds, heat-up to 145 °C, soak to 205 °C, a ramp to
 * a single peak (228–250 °C), cooling to 60 °C, then 40 °C. Every threshold of the SAC305 window is
 * crossed with a slope of at least 0.4 °C/s and the peak sample stands at least 0.4 °C above its
 * neighbours, so small conversion errors cannot change which thresholds are crossed or which
 * sample is the peak.
 */
const profileArb = fc.record({
  start: fc.integer({ min: 18, max: 21 }),
  heat: fc.integer({ min: 60, max: 110 }),
  soak: fc.integer({ min: 50, max: 130 }),
  ramp: fc.integer({ min: 12, max: 40 }),
  peak: fc.integer({ min: 228, max: 250 }),
  cool: fc.integer({ min: 50, max: 110 }),
});
type Profile = { start: number; heat: number; soak: number; ramp: number; peak: number; cool: number };

function knotsOf(p: Profile): Knot[] {
  const t1 = p.heat, t2 = t1 + p.soak, t3 = t2 + p.ramp, t4 = t3 + p.cool;
  return [[0, p.start], [t1, 145], [t2, 205], [t3, p.peak], [t4, 60], [t4 + 40, 40]];
}

const channelsArb = fc.array(
  fc.record({ lag: fc.integer({ min: 0, max: 8 }), raise: fc.integer({ min: -6, max: 6 }).map((x) => x / 2) }),
  { minLength: 2, maxLength: 6 },
);

function build(p: Profile, shifts: Array<{ lag: number; raise: number }>) {
  const base = knotsOf(p);
  const end = base[base.length - 1][0] + 10;
  const times = Array.from({ length: end + 1 }, (_, k) => k);
  const channels = shifts.map(({ lag, raise }, i) => {
    const knots: Knot[] = [[0, p.start + raise], ...base.map(([t, v]) => [t + lag, v + raise] as const)];
    return { header: `TC${i + 1}`, celsius: (t: number) => at(knots, t) };
  });
  return { times, channels };
}

function metricsByName(result: AnalysisResult) {
  return Object.fromEntries(result.channels.map((c) => [c.name, c]));
}

/** The critical phase starts at the earliest 200 °C crossing; keep it off sample times so one sample cannot flip in or out. */
function startIsOffGrid(times: number[], channels: Array<{ celsius: (t: number) => number }>): boolean {
  const start = Math.min(...channels.map((c) => firstUpCrossing(times, times.map(c.celsius), 200) ?? Infinity));
  return Math.abs(start - Math.round(start)) > 0.3;
}

function expectClose(a: AnalysisResult, b: AnalysisResult, tol: { temperature: number; time: number; rate: number }) {
  const kinds: Record<string, keyof typeof tol> = {
    peak: "temperature", timeAtPeak: "time", tal: "time", heatUpRate: "rate", rampUpMax: "rate", rampDownMax: "rate",
    soakTime: "time", timeToPeak: "time", peakMin: "temperature", peakMax: "temperature", deltaTPeak: "temperature",
    criticalSpread: "temperature", soakTimeMin: "time", soakTimeMax: "time", talMin: "time", talMax: "time", timeToPeakMax: "time",
  };
  const ma = metricsByName(a);
  const mb = metricsByName(b);
  expect(Object.keys(mb).sort()).toEqual(Object.keys(ma).sort());
  for (const [name, ca] of Object.entries(ma)) {
    for (const [key, va] of Object.entries(ca)) {
      if (key === "name") continue;
      const vb = mb[name][key as keyof typeof ca] as number | null;
      expect(vb === null, `${name}.${key} null-ness`).toBe(va === null);
      if (va !== null) expect(Math.abs((va as number) - vb!), `${name}.${key}: ${va} vs ${vb}`).toBeLessThanOrEqual(tol[kinds[key]]);
    }
  }
  for (const [key, va] of Object.entries(a.board)) {
    const vb = b.board[key as keyof typeof b.board] as number | null;
    expect(vb === null, `board.${key} null-ness`).toBe(va === null);
    if (va !== null) expect(Math.abs((va as number) - vb!), `board.${key}: ${va} vs ${vb}`).toBeLessThanOrEqual(tol[kinds[key]]);
  }
}

describe("properties of the analysis", () => {
  it("column order does not change any probe's or the board's metrics", () => {
    const arb = channelsArb.chain((shifts) =>
      fc.tuple(fc.constant(shifts), fc.shuffledSubarray(shifts.map((_, i) => i), { minLength: shifts.length, maxLength: shifts.length })),
    );
    fc.assert(
      fc.property(profileArb, arb, (p, [shifts, order]) => {
        const { times, channels } = build(p, shifts);
        const shuffled = order.map((i) => channels[i]);
        const original = analyzeLoggerFile({ text: writeFile({ times, channels }) }, { units: "C" });
        const reordered = analyzeLoggerFile({ text: writeFile({ times, channels: shuffled }) }, { units: "C" });
        expect(reordered.channels.map((c) => c.name)).toEqual(order.map((i) => `TC${i + 1}`));
        expect(metricsByName(reordered)).toEqual(metricsByName(original));
        expect(reordered.board).toEqual(original.board);
        expect(reordered.verdict).toEqual(original.verdict);
      }),
      { numRuns: 60 },
    );
  });

  it("°C, °F, type K millivolts and decimal-comma files give the same metrics within the conversion's error", () => {
    // °F and decimal commas lose nothing but rounding (1e-9). Millivolts: NIST inverse error ≤ 0.05 °C,
    // so temperatures within 0.06 °C, crossing times within 0.05 / 0.4 s plus margin (0.3 s), rates 0.02 °C/s.
    const exact = { temperature: 1e-9, time: 1e-9, rate: 1e-9 };
    const millivolt = { temperature: 0.06, time: 0.3, rate: 0.02 };
    fc.assert(
      fc.property(profileArb, channelsArb, (p, shifts) => {
        const { times, channels } = build(p, shifts);
        fc.pre(startIsOffGrid(times, channels));
        const withUnit = (unit: string) => channels.map((c) => ({ ...c, header: `${c.header} (${unit})` }));
        const celsius = analyzeLoggerFile({ text: writeFile({ times, channels: withUnit("°C") }) });
        const fahrenheit = analyzeLoggerFile({ text: writeFile({ times, channels: withUnit("°F"), encode: toFahrenheit }) });
        const comma = analyzeLoggerFile({ text: writeFile({ times, channels: withUnit("°C"), delimiter: ";", decimalComma: true }) });
        const mv = analyzeLoggerFile({ text: writeFile({ times, channels: withUnit("mV"), encode: (c) => emfMillivolts("K", c)! }) });
        expectClose(celsius, fahrenheit, exact);
        expectClose(celsius, comma, exact);
        expectClose(celsius, mv, millivolt);
      }),
      { numRuns: 60 },
    );
  });

  it("identical curves scanned with a skew show near-zero critical spread once aligned", () => {
    /*
     * Smooth curve T(t) = c − a·cos(π t / half), peak c + a at t = half. Linear interpolation
     * between samples 1 s apart errs by at most h²/8 · max|T''| = a(π/half)²/8 per probe, so the
     * spread between aligned probes is at most a(π/half)²/4 (below 0.006 °C here), while the
     * unaligned spread is about the slope times (m − 1)·skew.
     */
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 8 }).chain((m) => fc.tuple(fc.constant(m), fc.double({ min: 0.02, max: 0.95 / (m - 1), noNaN: true }))),
        fc.integer({ min: 180, max: 300 }),
        fc.integer({ min: 100, max: 115 }),
        ([m, skew], half, a) => {
          const c = 135;
          const curve = (t: number) => c - a * Math.cos((Math.PI * Math.min(t, 2 * half)) / half);
          const times = Array.from({ length: 2 * half + 1 }, (_, k) => k);
          const channels = Array.from({ length: m }, (_, i) => ({ header: `P${i + 1}`, celsius: curve }));
          const text = writeFile({ times, channels, skew });
          const bound = (a * (Math.PI / half) ** 2) / 4;
          const aligned = analyzeLoggerFile({ text }, { skewSeconds: skew, units: "C" });
          expect(aligned.board.criticalSpread!).toBeLessThanOrEqual(bound + 1e-9);
          expect(aligned.board.deltaTPeak).toBeLessThanOrEqual(bound + 1e-9);
          const raw = analyzeLoggerFile({ text }, { units: "C" });
          expect(raw.board.criticalSpread!).toBeGreaterThan(aligned.board.criticalSpread!);
        },
      ),
      { numRuns: 60 },
    );
  });
});

describe("garbage in: only ThermalFileError comes out", () => {
  const optionsArb: fc.Arbitrary<AnalyzeOptions> = fc.record(
    {
      units: fc.constantFrom("C", "F", "mV"),
      thermocouple: fc.constantFrom("K", "J", "T"),
      coldJunctionC: fc.double({ min: -80, max: 150, noNaN: true }),
      skewSeconds: fc.double({ min: -3, max: 3, noNaN: true }),
      offsets: fc.dictionary(fc.constantFrom("TC1", "TC2", "x", "P1"), fc.double({ min: -5, max: 5, noNaN: true })),
      columns: fc.array(fc.constantFrom("TC1", "TC2", "TC3", "x"), { maxLength: 3 }),
      setPointColumn: fc.constantFrom("Setpoint", "Time", "TC1", "none"),
    },
    { requiredKeys: [] },
  ) as fc.Arbitrary<AnalyzeOptions>;

  function onlyThermalErrors(run: () => unknown): void {
    try {
      run();
    } catch (error) {
      if (!(error instanceof ThermalFileError)) throw error;
      expect(typeof error.code).toBe("string");
      expect([400, 413, 415]).toContain(error.status);
      expect(error.message.length).toBeGreaterThan(10);
    }
  }

  it("random strings", () => {
    fc.assert(
      fc.property(fc.string({ unit: "binary", maxLength: 600 }), optionsArb, (text, options) => {
        onlyThermalErrors(() => analyzeLoggerFile({ text }, options));
        onlyThermalErrors(() => describeColumns(text));
      }),
      { numRuns: 300 },
    );
  });

  it("random bytes", () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 600 }), (bytes) => {
        onlyThermalErrors(() => analyzeLoggerFile({ bytes }));
        onlyThermalErrors(() => describeColumns(bytes));
      }),
      { numRuns: 300 },
    );
  });

  it("table-shaped garbage: real headers, mixed cells, random delimiters", () => {
    const header = fc.constantFrom("Time", "Time (s)", "t", "Date", "TC1", "TC2 (°C)", "TC3 [mV]", "Probe 3 degF", "Setpoint", "", "No.", "x", '"q"');
    const cell = fc.oneof(
      fc.double({ noNaN: false }).map(String),
      fc.integer({ min: -400, max: 2000 }).map(String),
      fc.constantFrom("", " ", "abc", "12,5", "1.5e400", "-0", "NaN", "Infinity", "00:01", "00:00:01", "2024-05-06 10:00:00", "06/05/2024 10:00 PM", '"', '"1,2"', "\u0001", "ÿ", "9.1531"),
    );
    const table = fc.record({
      delimiter: fc.constantFrom(",", ";", "\t"),
      newline: fc.constantFrom("\n", "\r\n", "\r"),
      header: fc.array(header, { minLength: 1, maxLength: 6 }),
      rows: fc.array(fc.array(cell, { maxLength: 7 }), { maxLength: 30 }),
    });
    fc.assert(
      fc.property(table, optionsArb, (t, options) => {
        const text = [t.header.join(t.delimiter), ...t.rows.map((r) => r.join(t.delimiter))].join(t.newline);
        onlyThermalErrors(() => analyzeLoggerFile({ text }, options));
        onlyThermalErrors(() => describeColumns({ text }));
      }),
      { numRuns: 500 },
    );
  });

  it("mostly valid files with one random cell spoiled", () => {
    const rows = Array.from({ length: 15 }, (_, k) => [String(k), String(20 + 10 * k), String(21 + 10 * k)]);
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 14 }), fc.integer({ min: 0, max: 2 }), fc.string({ maxLength: 8 }), optionsArb, (r, c, value, options) => {
        const copy = rows.map((row) => row.slice());
        copy[r][c] = value;
        const text = ["Time,TC1,TC2", ...copy.map((row) => row.join(","))].join("\n");
        onlyThermalErrors(() => analyzeLoggerFile({ text }, options));
      }),
      { numRuns: 300 },
    );
  });
});
