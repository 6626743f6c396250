import { describe, expect, it } from "vitest";
import { analyzeLoggerFile } from "@/lib/thermal/analyze";
import { describeColumns } from "@/lib/thermal/describe-columns";
import { emfMillivolts, type ThermocoupleType } from "@/lib/thermal/its90";
import { parseLoggerFile } from "@/lib/thermal/parse-logger-file";
import { expectThreeChannelMetrics, type Tolerance } from "./helpers/expected";
import { at, P, pad2, raised, SECONDS_0_TO_420, threeChannels, toFahrenheit, writeFile } from "./helpers/profiles";

/*
 * The hand-derived three-probe profile (see metrics-piecewise.test.ts) written in every supported
 * encoding must give the same metrics. °F, decimal commas and time formats lose nothing (1e-9).
 * Millivolts go through the NIST inverse polynomials, whose stated error is at most 0.05 °C
 * (NIST SRD 60 / Monograph 175); a 0.05 °C error moves a crossing by 0.05 °C ÷ slope, at most
 * 0.05 / (5/9) = 0.09 s on these curves, so times are checked to 0.15 s, temperatures to 0.06 °C
 * and rates to 0.02 °C/s.
 */
const MILLIVOLT: Tolerance = { temperature: 0.06, time: 0.15, rate: 0.02 };

describe("temperature encodings", () => {
  it("reads °F headers", () => {
    const text = writeFile({ times: SECONDS_0_TO_420, channels: threeChannels("°F"), encode: toFahrenheit });
    const result = analyzeLoggerFile({ text });
    expect(result.meta.units).toBe("F");
    expectThreeChannelMetrics(result, { temperature: 1e-9, time: 1e-9, rate: 1e-9 });
  });

  it("reads units given as an option when the headers carry none", () => {
    const channels = threeChannels().map((c) => ({ ...c, header: c.header.replace(" (°C)", "") }));
    const text = writeFile({ times: SECONDS_0_TO_420, channels, encode: toFahrenheit });
    const result = analyzeLoggerFile({ text }, { units: "F" });
    expect(result.meta.units).toBe("F");
    expect(result.meta.warnings).toEqual([]);
    expectThreeChannelMetrics(result);
  });

  it("reads headers such as 'Probe 3 degF' and strips the unit from the probe name", () => {
    const channels = threeChannels().map((c, i) => ({ ...c, header: `TC${i + 1} degF` }));
    const text = writeFile({ times: SECONDS_0_TO_420, channels, encode: toFahrenheit });
    expectThreeChannelMetrics(analyzeLoggerFile({ text }));
  });

  it.each<ThermocoupleType>(["K", "J", "T"])("reads type %s thermocouple millivolts through the ITS-90 inverse", (type) => {
    const text = writeFile({ times: SECONDS_0_TO_420, channels: threeChannels("mV"), encode: (c) => emfMillivolts(type, c)! });
    const result = analyzeLoggerFile({ text }, { thermocouple: type });
    expect(result.meta).toMatchObject({ units: "mV", thermocouple: type, coldJunctionC: 0 });
    expectThreeChannelMetrics(result, MILLIVOLT);
  });

  it("compensates a 25 °C cold junction: t = inverse(E + E(25 °C))", () => {
    const e25 = emfMillivolts("K", 25)!;
    const channels = threeChannels().map((c, i) => ({ ...c, header: `TC${i + 1} [mV]` }));
    const text = writeFile({ times: SECONDS_0_TO_420, channels, encode: (c) => emfMillivolts("K", c)! - e25 });
    const result = analyzeLoggerFile({ text }, { coldJunctionC: 25 });
    expect(result.meta).toMatchObject({ units: "mV", thermocouple: "K", coldJunctionC: 25 });
    expectThreeChannelMetrics(result, MILLIVOLT);
    // Without compensation the same file reads about 25 °C low, so the peaks are far off.
    const naive = analyzeLoggerFile({ text });
    expect(naive.board.peakMax).toBeLessThan(222);
  });
});

describe("delimiters, decimal separators and line endings", () => {
  it("reads semicolons with decimal commas", () => {
    const text = writeFile({ times: SECONDS_0_TO_420, channels: threeChannels(), delimiter: ";", decimalComma: true });
    // t = 150: P(150) = 150 + 46·5/9 = 175.55… written "175,55…".
    expect(text.split("\n")[151]).toMatch(/^150;175,5{5,}\d*;179,5{5,}\d*;/);
    const parsed = parseLoggerFile({ text });
    expect(parsed).toMatchObject({ delimiter: ";", decimalSeparator: "," });
    expectThreeChannelMetrics(analyzeLoggerFile({ text }));
  });

  it("reads tabs, CRLF and a UTF-8 byte-order mark from bytes", () => {
    const text = "\ufeff" + writeFile({ times: SECONDS_0_TO_420, channels: threeChannels(), delimiter: "\t", newline: "\r\n" });
    const bytes = new TextEncoder().encode(text);
    expect(Array.from(bytes.slice(0, 3))).toEqual([0xef, 0xbb, 0xbf]);
    expect(parseLoggerFile({ bytes }).delimiter).toBe("\t");
    // The mark is not part of the first header, even when that header is quoted.
    expect(describeColumns(bytes).timeColumn).toBe("Time (s)");
    expect(describeColumns(new TextEncoder().encode('\ufeff"Time (s)","TC1"\r\n0,1\r\n')).timeColumn).toBe("Time (s)");
    expectThreeChannelMetrics(analyzeLoggerFile({ bytes }));
  });
});

describe("quoted cells", () => {
  it("reads quoted headers and quoted decimal-comma cells in a comma-separated file", () => {
    // A comma file can only hold decimal commas inside quotes: "216,5". (Quoted files are parsed whole.)
    const plain = writeFile({ times: SECONDS_0_TO_420, channels: threeChannels(), delimiter: ";", decimalComma: true });
    const quoted = plain
      .split("\n")
      .map((line) => (line === "" ? line : line.split(";").map((cell) => `"${cell}"`).join(",")))
      .join("\n");
    expect(quoted.split("\n")[0]).toBe('"Time (s)","TC1 (°C)","TC2 (°C)","TC3 (°C)"');
    expect(parseLoggerFile({ text: quoted })).toMatchObject({ delimiter: ",", decimalSeparator: "," });
    expectThreeChannelMetrics(analyzeLoggerFile({ text: quoted }));
  });
});

describe("time columns", () => {
  const clock = (t: number) => `${pad2(Math.floor(t / 60))}:${pad2(t % 60)}`;

  it("reads mm:ss", () => {
    const text = writeFile({ timeHeader: "Time", times: SECONDS_0_TO_420, channels: threeChannels(), formatTime: clock });
    expect(text).toContain("\n03:34,240,244,");
    expect(parseLoggerFile({ text }).timeFormat).toBe("mm:ss");
    expectThreeChannelMetrics(analyzeLoggerFile({ text }));
  });

  it("reads hh:mm:ss clock times that pass midnight", () => {
    // Start at 23:58:00; t = 120 s is 00:00:00 the next day.
    const tod = (t: number) => {
      const s = (23 * 3600 + 58 * 60 + t) % 86400;
      return `${pad2(Math.floor(s / 3600))}:${pad2(Math.floor((s % 3600) / 60))}:${pad2(s % 60)}`;
    };
    const text = writeFile({ timeHeader: "Clock", times: SECONDS_0_TO_420, channels: threeChannels(), formatTime: tod });
    expect(text).toContain("\n00:00:00,");
    const parsed = parseLoggerFile({ text });
    expect(parsed.timeFormat).toBe("hh:mm:ss");
    expect(parsed.time[420]).toBe(420);
    expectThreeChannelMetrics(analyzeLoggerFile({ text }));
  });

  it("reads ISO 8601 date-times as seconds from the first row", () => {
    const iso = (t: number) => new Date(Date.UTC(2024, 4, 6, 10, 0, 0) + t * 1000).toISOString().replace(".000Z", "Z");
    const text = writeFile({ timeHeader: "Timestamp", times: SECONDS_0_TO_420, channels: threeChannels(), formatTime: iso });
    expect(text).toContain("\n2024-05-06T10:03:34Z,240,244,");
    expect(parseLoggerFile({ text }).timeFormat).toBe("datetime");
    expectThreeChannelMetrics(analyzeLoggerFile({ text }));
  });

  it("reads day-first date-times with a space, across midnight, semicolon-separated", () => {
    const dmy = (t: number) => {
      const d = new Date(Date.UTC(2024, 4, 6, 23, 58, 0) + t * 1000);
      return `${pad2(d.getUTCDate())}.${pad2(d.getUTCMonth() + 1)}.${d.getUTCFullYear()} ${pad2(d.getUTCHours())}:${pad2(d.getUTCMinutes())}:${pad2(d.getUTCSeconds())}`;
    };
    const text = writeFile({ timeHeader: "Date/Time", times: SECONDS_0_TO_420, channels: threeChannels(), formatTime: dmy, delimiter: ";", decimalComma: true });
    expect(text).toContain("\n07.05.2024 00:00:00;");
    expectThreeChannelMetrics(analyzeLoggerFile({ text }));
  });

  it("reads fractional seconds and a millisecond header", () => {
    // Same profile, time column in ms: "Time (ms)" 0, 1000, 2000 …
    const text = writeFile({ timeHeader: "Time (ms)", times: SECONDS_0_TO_420, channels: threeChannels(), formatTime: (t) => String(t * 1000) });
    expectThreeChannelMetrics(analyzeLoggerFile({ text }));
  });
});

describe("columns", () => {
  it("analyses a chosen subset of probe columns in the given order", () => {
    const text = writeFile({ times: SECONDS_0_TO_420, channels: threeChannels() });
    const result = analyzeLoggerFile({ text }, { columns: ["TC3", "TC1 (°C)"] });
    expect(result.channels.map((c) => c.name)).toEqual(["TC3", "TC1"]);
    // Both peak at 240 °C: ΔT 0; TAL 63 for both.
    expect(result.board.deltaTPeak).toBe(0);
    expect(result.board.talMin).toBeCloseTo(63, 9);
  });

  it("ignores empty-header, text-only and sample-counter columns", () => {
    const text = writeFile({
      times: SECONDS_0_TO_420,
      channels: threeChannels(),
      extraColumns: [
        { header: "Comment", cell: (row) => (row === 3 ? "door open" : "") },
        { header: "No.", cell: (row) => String(row + 1) },
        { header: "", cell: () => "" },
      ],
    });
    const result = analyzeLoggerFile({ text });
    expect(result.meta.channels).toBe(3);
    expect(result.meta.warnings).toContain('Column "Comment" holds no numbers and was not read as a probe.');
    expectThreeChannelMetrics(result);
  });

  it("takes a set-point column out of the probes and computes the tracking error", () => {
    // Probes A = P and B = P + 4: board mean P + 2. Set point = P + 2 − 3 on even rows and
    // P + 2 + 1 on odd rows → |error| 3 on 211 even rows (0…420) and 1 on 210 odd rows:
    // mean (211·3 + 210·1) / 421 = 843/421, max 3.
    const b = raised(4);
    const text = writeFile({
      times: SECONDS_0_TO_420,
      channels: [{ header: "TC1 (°C)", celsius: (t) => at(P, t) }, { header: "TC2 (°C)", celsius: (t) => at(b, t) }],
      extraColumns: [{ header: "Setpoint (°C)", cell: (row, t) => String(at(P, t) + 2 + (row % 2 === 0 ? -3 : 1)) }],
    });
    const result = analyzeLoggerFile({ text });
    expect(result.channels.map((c) => c.name)).toEqual(["TC1", "TC2"]);
    expect(result.board.trackingError!.mean).toBeCloseTo(843 / 421, 9);
    expect(result.board.trackingError!.max).toBeCloseTo(3, 9);
    const parsed = parseLoggerFile({ text });
    expect(parsed.setPoint?.name).toBe("Setpoint");
    expect(parsed.setPoint?.values[1]).toBeCloseTo(at(P, 1) + 3, 12);
  });

  it("takes a set-point column named by option", () => {
    const text = writeFile({
      times: SECONDS_0_TO_420,
      channels: [{ header: "TC1", celsius: (t) => at(P, t) }, { header: "Oven", celsius: (t) => at(P, t) + 5 }],
    });
    const result = analyzeLoggerFile({ text }, { setPointColumn: "Oven" });
    expect(result.meta.channels).toBe(1);
    expect(result.board.trackingError!.mean).toBeCloseTo(5, 9);
    expect(analyzeLoggerFile({ text }).board.trackingError).toBeUndefined();
  });
});
