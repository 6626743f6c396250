// lib/mail is pure (CONVENTIONS.md rule 1): its own modules and the pure maintenance core only.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

const dir = path.resolve(__dirname, "../../../lib/mail");
const files = readdirSync(dir).filter((f) => f.endsWith(".ts"));

describe("lib/mail boundary", () => {
  it("has modules to check", () => expect(files.length).toBeGreaterThanOrEqual(4));
  it.each(files)("%s imports no database, React, Next or Node module", (file) => {
    const text = readFileSync(path.join(dir, file), "utf8");
    const specifiers = [...text.matchAll(/(?:import|export)[^"']*?from\s*["']([^"']+)["']|import\(\s*["']([^"']+)["']\s*\)/g)].map((m) => m[1] ?? m[2]);
    for (const s of specifiers) expect(s, `${file} imports ${s}`).toMatch(/^(\.\/[a-z0-9-]+|@\/lib\/maintenance\/[a-z0-9-]+)$/);
    expect(text).not.toMatch(/new Date\(\)|Date\.now\(\)/);
    expect(text.split("\n").length).toBeLessThanOrEqual(250);
  });
});
