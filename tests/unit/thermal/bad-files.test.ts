import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyzeLoggerFile, type AnalyzeOptions } from "@/lib/thermal/analyze";
import { MAX_FILE_BYTES, type LoggerFileInput } from "@/lib/thermal/decode";
import { ThermalFileError } from "@/lib/thermal/errors";
import { emfMillivolts } from "@/lib/thermal/its90";

const fixture = (name: string) => new Uint8Array(readFileSync(path.join(__dirname, "../../fixtures/logger-files", name)));

function failure(input: LoggerFileInput, options: AnalyzeOptions = {}): ThermalFileError {
  try {
    analyzeLoggerFile(input, options);
  } catch (error) {
    expect(error).toBeInstanceOf(ThermalFileError);
    return error as ThermalFileError;
  }
  throw new Error("expected a ThermalFileError, but the file was analysed");
}

/** A valid little file body: n rows of time and two probes. */
function rows(n: number, cells = (k: number) => `${k},${20 + k},${21 + k}`): string {
  return Array.from({ length: n }, (_, k) => cells(k)).join("\n");
}

describe("bad logger files give a ThermalFileError that names what and where", () => {
  it("empty file → 400 invalid_file", () => {
    for (const input of [{ bytes: new Uint8Array(0) }, { text: "" }, { text: " \r\n\n\t\n" }, { text: "\ufeff" }]) {
      const e = failure(input);
      expect(e).toMatchObject({ code: "invalid_file", status: 400 });
      expect(e.message).toMatch(/^The file is empty\. /);
    }
  });

  it("no probe columns → 400 invalid_file", () => {
    const e = failure({ text: `Time,Comment\n${rows(12, (k) => `${k},ok`)}` });
    expect(e).toMatchObject({ code: "invalid_file", status: 400 });
    expect(e.message).toContain("No probe columns found");
  });

  it("a non-numeric cell → 400 with the 1-based file line and the header (fixture bad-non-numeric.csv)", () => {
    const e = failure({ bytes: fixture("bad-non-numeric.csv") });
    expect(e).toMatchObject({ code: "invalid_file", status: 400, details: { row: 14, column: "TC3" } });
    expect(e.message).toBe(
      'Row 14, column "TC3": "abc" is not a number. Check the file\'s decimal separator (this file was read with a decimal point) and that the cell holds a plain number without text or units.',
    );
  });

  it("counts blank lines and the header in the row number; names the full header", () => {
    const text = `\nTime (s);TC1 (°C);TC2 (°C)\n${rows(5, (k) => `${k};20,5;21,5`)}\n\n5;20,5;21.5\n${rows(6, (k) => `${k + 6};22,5;23,5`)}`;
    // Line 1 blank, line 2 header, lines 3–7 data, line 8 blank, line 9 holds "21.5" in a decimal-comma file.
    const e = failure({ text });
    expect(e.details).toEqual({ row: 9, column: "TC2 (°C)" });
    expect(e.message).toContain("decimal comma");
  });

  it("keeps line numbers right deep inside a large file (parsed in chunks), blank lines included", () => {
    // 30 000 data rows (about 400 kB, several parse chunks) with a blank line after the header;
    // the spoiled cell sits on data row 25 000, i.e. file line 25 000 + 2 (header, blank) = 25 002.
    const lines = Array.from({ length: 30_000 }, (_, k) => `${k},${(20 + k / 1000).toFixed(3)},${(21 + k / 1000).toFixed(3)}`);
    lines[24_999] = "24999,25.1,x25";
    const e = failure({ text: `Time,TC1,TC2\n\n${lines.join("\n")}\n` });
    expect(e.details).toEqual({ row: 25_002, column: "TC2" });
  });

  it("an empty probe cell → 400 naming row and column", () => {
    const text = `Time,TC1,TC2\n${rows(5)}\n5,25,\n${rows(6, (k) => `${k + 6},1,2`)}`;
    const e = failure({ text });
    expect(e.details).toEqual({ row: 7, column: "TC2" });
    expect(e.message).toBe('Row 7, column "TC2" is empty. Every sample row needs a value in every probe column; fill the gap or remove the row, then upload the file again.');
  });

  it("time that does not increase → 400 with the row (fixture bad-time-not-increasing.csv)", () => {
    const e = failure({ bytes: fixture("bad-time-not-increasing.csv") });
    expect(e).toMatchObject({ code: "invalid_file", status: 400, details: { row: 20 } });
    expect(e.message).toMatch(/^Row 20: the time "17" does not come after the previous row's time\. /);
  });

  it("an unreadable time cell → 400 naming row and time column", () => {
    const e = failure({ text: `Time,TC1\n00:00,20\n00:01,21\nsoon,30\n${rows(10)}` });
    expect(e.details).toEqual({ row: 4, column: "Time" });
  });

  it("fewer than 10 data rows → 400", () => {
    const e = failure({ text: `Time,TC1,TC2\n${rows(9)}\n` });
    expect(e).toMatchObject({ code: "invalid_file", status: 400, details: { rows: 9, limit: 10 } });
    expect(e.message).toContain("a run needs at least 10");
    expect(() => analyzeLoggerFile({ text: `Time,TC1,TC2\n${rows(10)}\n` })).not.toThrow();
  });

  it("a header row of numbers → 400", () => {
    expect(failure({ text: rows(20) }).message).toMatch(/^Row 1 holds numbers, not column names\./);
  });

  it("binary data (NUL bytes) → 415 unsupported_file", () => {
    const bytes = new Uint8Array([0x54, 0x69, 0x6d, 0x65, 0x2c, 0x00, 0x01, 0x02, 0x0a]);
    expect(failure({ bytes })).toMatchObject({ code: "unsupported_file", status: 415 });
    expect(failure({ text: "Time,TC1\n0,\u0000\n" })).toMatchObject({ code: "unsupported_file", status: 415 });
  });

  it("invalid UTF-8 → 415 (a Latin-1 degree sign, 0xB0)", () => {
    const bytes = new Uint8Array([...new TextEncoder().encode("Time,TC1 ("), 0xb0, ...new TextEncoder().encode(`C)\n${rows(12)}\n`)]);
    const e = failure({ bytes });
    expect(e).toMatchObject({ code: "unsupported_file", status: 415 });
    expect(e.message).toContain("not valid UTF-8");
  });

  it("UTF-16 text → 415", () => {
    expect(failure({ bytes: new Uint8Array([0xff, 0xfe, 0x54, 0x00]) })).toMatchObject({ code: "unsupported_file", status: 415 });
  });

  it("many control characters → 415", () => {
    const junk = Array.from({ length: 400 }, (_, i) => String.fromCharCode(1 + (i % 8))).join("");
    const e = failure({ text: `Time,TC1\n${junk}\n${rows(12)}` });
    expect(e).toMatchObject({ code: "unsupported_file", status: 415 });
  });

  it("over 20 MB → 413 file_too_large, as bytes or as text", () => {
    expect(failure({ bytes: new Uint8Array(MAX_FILE_BYTES + 1) })).toMatchObject({ code: "file_too_large", status: 413 });
    expect(failure({ text: "x".repeat(MAX_FILE_BYTES + 1) })).toMatchObject({ code: "file_too_large", status: 413 });
    // 7 million "€" are 21 MB of UTF-8 (3 bytes each) although the string has only 7 M characters.
    expect(failure({ text: "€".repeat(7_000_000) })).toMatchObject({ code: "file_too_large", status: 413 });
  });

  it("more than 64 probes → 400", () => {
    const header = ["Time", ...Array.from({ length: 65 }, (_, i) => `TC${i + 1}`)].join(",");
    const body = rows(12, (k) => [k, ...Array.from({ length: 65 }, () => 25)].join(","));
    const e = failure({ text: `${header}\n${body}` });
    expect(e).toMatchObject({ code: "invalid_file", status: 400, details: { probes: 65, limit: 64 } });
  });

  it("more than 500 000 rows → 400", () => {
    const body = Array.from({ length: 500_001 }, (_, k) => `${k},1`).join("\n");
    const e = failure({ text: `t,TC1\n${body}` });
    expect(e).toMatchObject({ code: "invalid_file", status: 400, details: { rows: 500_001, limit: 500_000 } });
  });

  it("probe columns in different units → 400", () => {
    const e = failure({ text: `Time,TC1 (°C),TC2 (°F)\n${rows(12)}` });
    expect(e.message).toContain("different units (°C, °F)");
  });

  it("a millivolt value outside the thermocouple's range → 400 naming row and column", () => {
    const e = failure({ text: `Time,TC1 [mV]\n${rows(11, (k) => `${k},${k === 5 ? 80 : emfMillivolts("K", 100)}`)}` });
    expect(e.details).toEqual({ row: 7, column: "TC1 [mV]" });
    expect(e.message).toContain("not a plausible temperature for this thermocouple type");
  });

  it("an unclosed quote → 400 naming the row", () => {
    const e = failure({ text: `Time,TC1\n${rows(5, (k) => `${k},1`)}\n5,"7\n${rows(6, (k) => `${k + 6},1`)}` });
    expect(e.details).toEqual({ row: 7 });
  });

  it("options that do not fit the file → 400 invalid_options naming the field", () => {
    const text = `Time,TC1,TC2\n${rows(12)}`;
    expect(failure({ text }, { columns: ["TC9"] })).toMatchObject({ code: "invalid_options", details: { field: "columns" } });
    expect(failure({ text }, { setPointColumn: "Oven" })).toMatchObject({ code: "invalid_options", details: { field: "setPointColumn" } });
    expect(failure({ text }, { coldJunctionC: 400 })).toMatchObject({ code: "invalid_options", details: { field: "coldJunctionC" } });
    expect(failure({ text }, { skewSeconds: Number.NaN })).toMatchObject({ code: "invalid_options", details: { field: "skewSeconds" } });
    expect(failure({ text }, { offsets: { TC1: Number.POSITIVE_INFINITY } })).toMatchObject({ details: { field: "offsets" } });
    const w = failure({ text }, { window: { liquidus: 217 } as never });
    expect(w).toMatchObject({ code: "invalid_options" });
    expect(String(w.details.field)).toMatch(/^window\./);
  });
});
