import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { describeColumns } from "@/lib/thermal/describe-columns";
import { ThermalFileError } from "@/lib/thermal/errors";

describe("describeColumns (for the upload wizard)", () => {
  it("describes the sample 8-probe file", () => {
    const bytes = new Uint8Array(readFileSync(path.join(__dirname, "../../fixtures/logger-files/generic-8ch.csv")));
    const d = describeColumns(bytes);
    expect(d).toMatchObject({
      delimiter: ",", decimalSeparator: ".", timeColumn: "Time (s)", timeFormat: "seconds",
      probes: ["TC1", "TC2", "TC3", "TC4", "TC5", "TC6", "TC7", "TC8"], units: "C", rows: 421, setPointColumn: null,
    });
    expect(d.preview.header[1]).toBe("TC1 (°C)");
    expect(d.preview.rows).toHaveLength(5);
    expect(d.preview.rows[0][0]).toBe("0");
  });

  it("reports every column's role, unit and why it is not a probe", () => {
    const text = [
      "Date/Time;No.;Setpoint (°C);TC1 [mV];Probe 2 degF;Comment;",
      ...Array.from({ length: 3 }, (_, k) => `06.05.2024 10:00:0${k};${k + 1};150,5;1,2;77,5;;`),
    ].join("\r\n");
    const d = describeColumns(text);
    expect(d).toMatchObject({ delimiter: ";", decimalSeparator: ",", timeFormat: "datetime", setPointColumn: "Setpoint (°C)", units: "mixed" });
    expect(d.columns.map((c) => [c.header, c.role, c.unit, c.note ?? null])).toEqual([
      ["Date/Time", "time", null, null],
      ["No.", "ignored", null, "sample counter"],
      ["Setpoint (°C)", "setPoint", "C", null],
      ["TC1 [mV]", "probe", "mV", null],
      ["Probe 2 degF", "probe", "F", null],
      ["Comment", "ignored", null, "holds no numbers"],
      ["", "ignored", null, "empty header"],
    ]);
    expect(d.probes).toEqual(["TC1", "Probe 2"]);
  });

  it("reads mm:ss and a header with no units; still refuses binary files", () => {
    const d = describeColumns({ text: "Time\tA\tB\n00:00\t1\t2\n00:01\t1\t2\n" });
    expect(d).toMatchObject({ delimiter: "\t", timeFormat: "mm:ss", units: null, probes: ["A", "B"] });
    expect(() => describeColumns(new Uint8Array([0, 1, 2, 3]))).toThrow(ThermalFileError);
  });
});
