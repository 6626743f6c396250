import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

/*
 * lib/maintenance is the pure core (CONVENTIONS rule 1): no React, Next, db or node:* imports,
 * no clock reads (`now` is always passed in), kebab-case files of about 250 lines, no barrel.
 */
const dir = path.resolve(__dirname, "../../../lib/maintenance");
const files = readdirSync(dir).filter((f) => f.endsWith(".ts"));

describe("lib/maintenance boundaries", () => {
  it("has files to check", () => expect(files.length).toBeGreaterThan(5));

  for (const file of files) {
    it(file, () => {
      const src = readFileSync(path.join(dir, file), "utf8");
      const imports = [...src.matchAll(/from\s+"([^"]+)"/g)].map((m) => m[1]);
      const allowed = /^(\.\/[a-z0-9-]+|rrule|@date-fns\/tz|date-fns|zod)$/;
      for (const spec of imports) expect(spec, `${file} imports ${spec}`).toMatch(allowed);
      expect(src).not.toMatch(/Date\.now\(|new Date\(\)|performance\.now\(/);
      expect(file).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*\.ts$/);
      expect(file).not.toBe("index.ts");
      expect(src.split("\n").length).toBeLessThanOrEqual(260);
    });
  }
});
