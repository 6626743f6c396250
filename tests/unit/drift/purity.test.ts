// lib/drift is a pure core: it may import only its own modules (CONVENTIONS.md rule 1).
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

const dir = path.resolve(__dirname, "../../../lib/drift");
const files = readdirSync(dir).filter((f) => f.endsWith(".ts"));

describe("lib/drift boundary", () => {
  it("has modules to check", () => {
    expect(files.length).toBeGreaterThan(10);
  });

  it.each(files)("%s imports only sibling modules and stays under ~250 lines", (file) => {
    const text = readFileSync(path.join(dir, file), "utf8");
    const specifiers = [...text.matchAll(/(?:import|export)[^"']*?from\s*["']([^"']+)["']|import\(\s*["']([^"']+)["']\s*\)/g)].map((m) => m[1] ?? m[2]);
    for (const s of specifiers) expect(s, `${file} imports ${s}`).toMatch(/^\.\/[a-z0-9-]+$/);
    expect(text.split("\n").length).toBeLessThanOrEqual(250);
    expect(file).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*\.ts$/);
    expect(file).not.toBe("index.ts");
  });
});
