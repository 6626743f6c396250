import fs from "node:fs";
import path from "node:path";
import fc from "fast-check";

/*
 * Inputs for fuzzing the write routes and server actions: plausible field names and values
 * (taken from the app's own zod schemas, so new fields are fuzzed without listing them) mixed
 * with hostile ones: huge and non-finite numbers, numeric strings that overflow, path
 * traversal, prototype-pollution keys, control characters, lone surrogates, long strings.
 */

type Vocabulary = { keys: string[]; words: string[] };

/** Field names and enum/literal values of every schema exported from lib/validation/. */
export async function schemaVocabulary(): Promise<Vocabulary> {
  const dir = path.resolve(__dirname, "../../../lib/validation");
  const keys = new Set<string>();
  const words = new Set<string>();
  const seen = new Set<unknown>();
  const visit = (v: unknown): void => {
    if (!v || typeof v !== "object" || seen.has(v)) return;
    seen.add(v);
    if (Array.isArray(v)) return v.forEach(visit);
    const def = (v as { _zod?: { def?: Record<string, unknown> } })._zod?.def;
    if (!def) return;
    if (def.type === "object") for (const [k, s] of Object.entries(def.shape as Record<string, unknown>)) (keys.add(k), visit(s));
    if (def.type === "enum") for (const e of Object.values(def.entries as Record<string, unknown>)) if (typeof e === "string") words.add(e);
    if (def.type === "literal") for (const e of def.values as unknown[]) if (typeof e === "string") words.add(e);
    for (const [k, s] of Object.entries(def)) if (k !== "shape" && typeof s === "object") visit(s);
  };
  for (const f of fs.readdirSync(dir).filter((f) => f.endsWith(".ts"))) Object.values(await import(path.join(dir, f))).forEach(visit);
  return { keys: [...keys].sort(), words: [...words].sort() };
}

export const POLLUTION_KEYS = ["__proto__", "constructor", "prototype"];

export const hostileString = fc.oneof(
  fc.constantFrom(
    "", " ", "../../etc/passwd", "..\\..\\windows\\win.ini", "/etc/passwd", "%2e%2e%2f", "a/../../b", "\u0000", "nul\u0000byte",
    "NaN", "Infinity", "-Infinity", "-1", "0", "1e309", "-1e309", "9".repeat(400), "0x1F", "1.5", "1,5", "true", "null", "undefined",
    "__proto__", "constructor", "<script>alert(1)</script>", "' OR 1=1 --", "=HYPERLINK(\"x\")", "\uD800", "\uFEFFbom", "ℌ𝔢𝔩𝔩𝔬 🔥",
    "2026-13-45T25:61", "2026-02-30", "0000-00-00", "+275760-09-13T00:00:00.001Z", "2026-01-10", "2026-01-03T07:00", "FREQ=SECONDLY;INTERVAL=0",
    "FREQ=DAILY;COUNT=99999999", "x".repeat(20_000),
  ),
  fc.string({ maxLength: 40 }),
  fc.string({ unit: "binary", maxLength: 40 }),
  fc.string({ maxLength: 3000 }),
);

export const hostileNumber = fc.oneof(
  fc.integer(),
  fc.integer({ min: -3, max: 60 }), // around the ids the demo seed makes
  fc.double(), // includes NaN and ±Infinity, which JSON writes as null
  fc.constantFrom(0, -0, 1, 2, 3, 1.5, -1, 2 ** 31, 2 ** 53 + 2, 2 ** 63, 1e21, 1e308, -1e308, Number.MIN_VALUE, 86_400_000 * 1e8),
);

/** Any JSON value, nested, with plausible and hostile keys. */
export function jsonValue(vocab: Vocabulary) {
  const key = fc.oneof({ weight: 6, arbitrary: fc.constantFrom(...vocab.keys) }, { weight: 1, arbitrary: fc.constantFrom(...POLLUTION_KEYS) }, { weight: 1, arbitrary: fc.string({ maxLength: 12 }) });
  const leaf = fc.oneof(
    { weight: 3, arbitrary: hostileString },
    { weight: 2, arbitrary: fc.constantFrom(...vocab.words) },
    { weight: 3, arbitrary: hostileNumber },
    { weight: 1, arbitrary: fc.boolean() },
    { weight: 1, arbitrary: fc.constant(null) },
  );
  const { value } = fc.letrec((tie) => ({
    value: fc.oneof({ depthSize: "small", withCrossShrink: true }, leaf, tie("array"), tie("object")),
    array: fc.array(tie("value"), { maxLength: 5 }),
    object: fc.array(fc.tuple(key, tie("value")), { maxLength: 8 }).map((entries) => new RawObject(entries)),
  }));
  const body = fc.array(fc.tuple(key, value), { maxLength: 12 }).map((entries) => new RawObject(entries));
  return { key, leaf, value, body };
}

/** An object written with its keys as given, so "__proto__" reaches the server as a JSON key. */
export class RawObject {
  constructor(readonly entries: [string, unknown][]) {}
  toJSONText(): string {
    return `{${this.entries.map(([k, v]) => `${JSON.stringify(k)}:${toJsonText(v)}`).join(",")}}`;
  }
}

export function toJsonText(v: unknown): string {
  if (v instanceof RawObject) return v.toJSONText();
  if (Array.isArray(v)) return `[${v.map(toJsonText).join(",")}]`;
  return JSON.stringify(v) ?? "null";
}

/** Plain values for a form: what a browser can send (strings and files). */
export function toFormValue(v: unknown): string {
  if (typeof v === "string") return v;
  return toJsonText(v);
}

const MAGIC: Record<string, number[]> = {
  png: [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a],
  jpeg: [0xff, 0xd8, 0xff, 0xe0],
  pdf: [0x25, 0x50, 0x44, 0x46, 0x2d, 0x31, 0x2e, 0x37],
  webp: [0x52, 0x49, 0x46, 0x46, 0x10, 0, 0, 0, 0x57, 0x45, 0x42, 0x50],
  exe: [0x4d, 0x5a, 0x90, 0x00],
  html: [...Buffer.from("<!doctype html><script>alert(1)</script>")],
  svg: [...Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>')],
};

export const hostileFileName = fc.oneof(
  fc.constantFrom("../../etc/passwd", "..\\..\\boot.ini", "/etc/shadow", "photo.png", "photo.png.exe", "run.csv", "a\u0000.png", ".htaccess", "CON", "x".repeat(600), "réservé 🔥.pdf", ""),
  fc.string({ maxLength: 30 }),
);

/** File contents: random bytes, or a real magic number followed by junk, sometimes a logger file. */
export function fileBytes(loggerSamples: Uint8Array[]) {
  return fc.oneof(
    fc.uint8Array({ maxLength: 2048 }),
    fc.tuple(fc.constantFrom(...Object.values(MAGIC)), fc.uint8Array({ maxLength: 512 })).map(([m, rest]) => Uint8Array.from([...m, ...rest])),
    fc.tuple(fc.constantFrom(...loggerSamples), fc.nat(), fc.uint8Array({ maxLength: 64 })).map(([s, cut, junk]) => Uint8Array.from([...s.subarray(0, cut % (s.length + 1)), ...junk])),
  );
}

export const claimedType = fc.constantFrom("image/png", "image/jpeg", "application/pdf", "text/csv", "application/octet-stream", "text/html", "image/svg+xml", "application/x-msdownload", "");
