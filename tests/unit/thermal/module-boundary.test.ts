import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

// CONVENTIONS.md rule 1: lib/thermal is pure TypeScript. It may import papaparse, zod and its own
// files; windows.ts, shared with forms, only zod. Files stay under about 250 lines; no barrel.
const dir = path.join(__dirname, "../../../lib/thermal");
const files = readdirSync(dir).filter((f) => f.endsWith(".ts"));

function imports(file: string): string[] {
  const source = readFileSync(path.join(dir, file), "utf8");
  return [...source.matchAll(/(?:^|\n)\s*(?:import|export)\s[^;]*?from\s+"([^"]+)"/g), ...source.matchAll(/import\("([^"]+)"\)|require\("([^"]+)"\)/g)]
    .map((m) => m[1] ?? m[2]);
}

describe("lib/thermal module boundary", () => {
  it("has the expected files and no index barrel", () => {
    expect(files.length).toBeGreaterThan(10);
    expect(files).not.toContain("index.ts");
    for (const f of files) expect(f).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*\.ts$/);
  });

  it.each(files)("%s imports only papaparse, zod and sibling files", (file) => {
    const found = imports(file);
    for (const spec of found) expect(spec === "papaparse" || spec === "zod" || spec.startsWith("./"), `${file} imports ${spec}`).toBe(true);
    if (file === "windows.ts") expect(found).toEqual(["zod"]);
  });

  it.each(files)("%s stays under 260 lines", (file) => {
    expect(readFileSync(path.join(dir, file), "utf8").split("\n").length).toBeLessThan(260);
  });
});
