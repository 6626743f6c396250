import { describe, expect, it } from "vitest";
import { csvCell, csvLine } from "@/lib/runs/csv";
import { offsetsByColumn, resolveMapping } from "@/lib/runs/mapping";
import { packSamples, unpackSamples } from "@/lib/runs/samples-codec";
import { parseSetPoints } from "@/lib/runs/xhr";

describe("csvCell (OWASP CSV injection: prefix =, +, -, @, tab, CR with an apostrophe)", () => {
  it.each([
    ["=1+2", "'=1+2"],
    ["+SUM(A1)", "'+SUM(A1)"],
    ["-2+3", "'-2+3"],
    ["@cmd", "'@cmd"],
    ["\tx", "'\tx"],
    ["LAB-B1", "LAB-B1"],
  ])("%j → %j", (input, out) => expect(csvCell(input)).toBe(out));
  it("quotes cells with commas, quotes or newlines (RFC 4180 §2.6–2.7)", () => {
    expect(csvCell('a "b", c')).toBe('"a ""b"", c"');
    expect(csvCell('=HYPERLINK("x")')).toBe(`"'=HYPERLINK(""x"")"`);
  });
  it("writes numbers as numbers and blanks for missing values", () => {
    expect(csvLine([1.5, null, undefined, Number.NaN, "ok"])).toBe("1.5,,,,ok");
  });
});

const cols = Array.from({ length: 4 }, (_, i) => ({ name: `TC${i + 1}`, header: `TC${i + 1} (°C)` }));

describe("resolveMapping", () => {
  it("takes a given mapping keyed by header or name", () => {
    const r = resolveMapping(cols, { "TC1 (°C)": "P2", TC2: "P1" }, null, ["P1", "P2", "P3"]);
    expect(r).toEqual({ mapping: { TC1: "P2", TC2: "P1" }, source: "given", problems: [] });
  });
  it("says when one probe position is given two columns, or a label is not on the board", () => {
    expect(resolveMapping(cols, { TC1: "P1", TC2: "P1" }, null, ["P1", "P2"]).problems).toEqual(["Probe position P1 is given to both TC1 and TC2."]);
    expect(resolveMapping(cols, { TC1: "Q9" }, null, ["P1"]).problems[0]).toMatch(/"Q9" is not a probe position/);
    expect(resolveMapping(cols, { TC9: "P1" }, null, ["P1"]).problems[0]).toMatch(/Column "TC9" is not a probe column/);
  });
  it("uses the remembered mapping when it fits the file, else proposes the board's order", () => {
    expect(resolveMapping(cols, undefined, { TC1: "P4", TC2: "P3" }, ["P1", "P2", "P3", "P4"]).source).toBe("remembered");
    const proposed = resolveMapping(cols, undefined, { TC7: "P1" }, ["P1", "P2", "P3"]);
    expect(proposed.source).toBe("board-order");
    expect(proposed.mapping).toEqual({ TC1: "P1", TC2: "P2", TC3: "P3" });
    expect(proposed.problems[0]).toMatch(/4 probe columns but the board has 3/);
  });
  it("uses the column names when there is no board or they are the board's labels", () => {
    expect(resolveMapping(cols, undefined, null, null).source).toBe("column-names");
    expect(resolveMapping(cols, undefined, null, ["TC1", "TC2", "TC3", "TC4"]).mapping.TC3).toBe("TC3");
  });
});

describe("offsetsByColumn", () => {
  it("maps logger channel numbers (1-based scan order) to the file's probe columns, skipping zeros", () => {
    expect(offsetsByColumn(cols, { "1": 0.2, "3": -0.1, "4": 0, "9": 1 })).toEqual({ TC1: 0.2, TC3: -0.1 });
  });
});

describe("packSamples / unpackSamples", () => {
  it("round-trips within Float32 precision (2^-24 relative, IEEE 754 binary32)", () => {
    const time = [0, 1, 2.5];
    const values = [[24.1, 150.37, 245.99], [23.9, 149.02, 240.01]];
    const back = unpackSamples(packSamples(time, values));
    expect(Array.from(back.time)).toEqual([0, 1, 2.5]);
    back.channels.forEach((c, i) => c.forEach((v, k) => expect(Math.abs(v - values[i][k])).toBeLessThan(values[i][k] * 2 ** -23)));
  });
});

describe("parseSetPoints", () => {
  it("reads zone=temperature pairs or a plain list", () => {
    expect(parseSetPoints("Z1=120, Z2: 150.5")).toEqual({ json: '{"Z1":120,"Z2":150.5}', error: null });
    expect(parseSetPoints("120 150 165")).toEqual({ json: "[120,150,165]", error: null });
    expect(parseSetPoints("")).toEqual({ json: null, error: null });
    expect(parseSetPoints("hot please").error).toMatch(/is not a zone and temperature/);
  });
});
