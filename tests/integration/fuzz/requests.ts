import fs from "node:fs";
import path from "node:path";
import fc from "fast-check";
import { expect } from "vitest";
import { ROLES, type Role } from "@/db/schema/users";
import { can, PERMISSIONS, type Permission } from "@/lib/permissions";
import type { Db } from "@/db/client";
import { createApiToken } from "@/db/queries/api-tokens";
import { getUserByEmail } from "@/db/queries/users";
import { isRouteFile, moduleExports, walk, WRITE_METHODS } from "../../matrix/enumerate";
import { claimedType, fileBytes, hostileFileName, hostileString, jsonValue, toFormValue, toJsonText } from "./arbitraries";
import type { Seed } from "./seeds";
import { mutate } from "./seeds";

// Random request bodies, headers and checks shared by the route fuzzing.
const ROOT = path.resolve(__dirname, "../../..");
const FIXTURES = path.join(ROOT, "tests/fixtures");
export const LOGGER_FILE = new Uint8Array(fs.readFileSync(path.join(FIXTURES, "logger-files/generic-8ch.csv")));
export const PNG_FILE = new Uint8Array(fs.readFileSync(path.join(FIXTURES, "checklist-photo.png")));
const loggerSamples = fs.readdirSync(path.join(FIXTURES, "logger-files")).map((f) => new Uint8Array(fs.readFileSync(path.join(FIXTURES, "logger-files", f))));

/** Every write handler under app/, found by parsing the route files: one entry per method. */
export function writeRoutes(): { file: string; method: (typeof WRITE_METHODS)[number] }[] {
  return walk(ROOT, path.join(ROOT, "app"))
    .filter(isRouteFile)
    .flatMap((file) => {
      const names = moduleExports(file, fs.readFileSync(path.join(ROOT, file), "utf8")).names;
      return WRITE_METHODS.filter((m) => names.has(m)).map((method) => ({ file, method }));
    });
}

/** A bearer token for each demo role's user, made straight in the database. */
export async function roleTokens(db: Db, name: string): Promise<Record<Role, string>> {
  const tokens = {} as Record<Role, string>;
  for (const role of ROLES) {
    const u = await getUserByEmail(db, role === "technician" ? "tech@brightwater.example" : `${role}@brightwater.example`);
    tokens[role] = (await createApiToken(db, { userId: u!.id, name: `${name}-${role}` }, null)).secret;
  }
  return tokens;
}

type Part = { name: string; value: string } | { name: string; fileName: string; bytes: Uint8Array; type: string };
export type BodyCase = { kind: "json"; text: string } | { kind: "multipart"; parts: Part[] } | { kind: "broken-multipart"; text: string } | { kind: "empty" };
type Vocab = Parameters<typeof jsonValue>[0];

export const hostileId = fc.oneof(
  { weight: 3, arbitrary: fc.integer({ min: 1, max: 40 }).map(String) },
  { weight: 2, arbitrary: fc.constantFrom("../", "..%2f..%2fetc%2fpasswd", "-1", "0", "1e309", "1.5", "NaN", " 7", "0x10", "9".repeat(1000), "1;DROP TABLE runs", "١٢", "") },
  { weight: 1, arbitrary: fc.string({ maxLength: 20 }) },
);

function formParts(vocab: Vocab) {
  const { value, key } = jsonValue(vocab);
  const field = fc.oneof(fc.constantFrom("file", "certificate", "attachment", "from", "mapping", "windowId"), key);
  const filePart = fc.record({ name: fc.oneof({ weight: 3, arbitrary: fc.constantFrom("file", "certificate") }, { weight: 1, arbitrary: field }), fileName: hostileFileName, bytes: fileBytes(loggerSamples), type: claimedType });
  return { field: fc.record({ name: field, value: value.map(toFormValue) }), filePart };
}

/** Anything at all: JSON of any shape, multipart with random parts, a broken multipart body, nothing. */
export function randomBody(vocab: Vocab): fc.Arbitrary<BodyCase> {
  const { body, value } = jsonValue(vocab);
  const { field, filePart } = formParts(vocab);
  return fc.oneof(
    { weight: 4, arbitrary: body.map((b) => ({ kind: "json" as const, text: toJsonText(b) })) },
    { weight: 1, arbitrary: value.map((v) => ({ kind: "json" as const, text: toJsonText(v) })) },
    { weight: 1, arbitrary: hostileString.map((s) => ({ kind: "json" as const, text: s })) },
    { weight: 3, arbitrary: fc.array(fc.oneof(field, filePart), { maxLength: 6 }).map((parts) => ({ kind: "multipart" as const, parts })) },
    { weight: 1, arbitrary: fc.string({ maxLength: 200 }).map((s) => ({ kind: "broken-multipart" as const, text: s })) },
    { weight: 1, arbitrary: fc.constant({ kind: "empty" as const }) },
  );
}

/** The seed's valid body, mutated: JSON values replaced, dropped or added; files cut, padded or renamed. */
export function mutatedBody(seed: Seed, vocab: Vocab): fc.Arbitrary<BodyCase> {
  const { value, key } = jsonValue(vocab);
  if (seed.multipart) {
    const valid = seed.multipart === "png" ? PNG_FILE : LOGGER_FILE;
    const bytes = fc.oneof(
      { weight: 2, arbitrary: fc.constant(valid) },
      { weight: 1, arbitrary: fc.nat({ max: valid.length }).map((n) => valid.subarray(0, n)) },
      { weight: 1, arbitrary: fc.uint8Array({ maxLength: 256 }).map((junk) => Uint8Array.from([...valid, ...junk])) },
      { weight: 1, arbitrary: fc.tuple(fc.nat({ max: valid.length - 1 }), fc.integer({ min: 0, max: 255 })).map(([i, b]) => Uint8Array.from(valid, (v, j) => (j === i ? b : v))) },
    );
    const file = fc.record({ name: fc.oneof({ weight: 4, arbitrary: fc.constant("file") }, { weight: 1, arbitrary: key }), fileName: hostileFileName, bytes, type: claimedType });
    const { field } = formParts(vocab);
    return fc.tuple(file, fc.array(field, { maxLength: 4 })).map(([f, fields]) => ({ kind: "multipart" as const, parts: [f, ...fields] }));
  }
  if (seed.json === undefined) return randomBody(vocab);
  return mutate(seed.json, value, key).map((b) => ({ kind: "json" as const, text: toJsonText(b) }));
}

export function buildBody(b: BodyCase): { body?: BodyInit; headers: Record<string, string> } {
  if (b.kind === "json") return { body: b.text, headers: { "content-type": "application/json" } };
  if (b.kind === "broken-multipart") return { body: b.text, headers: { "content-type": "multipart/form-data; boundary=fuzz" } };
  if (b.kind === "empty") return { headers: {} };
  const form = new FormData();
  for (const p of b.parts) {
    if ("bytes" in p) form.append(p.name, new File([p.bytes as BlobPart], p.fileName, { type: p.type }));
    else form.append(p.name, p.value);
  }
  return { body: form, headers: {} };
}

export function allowedRoles(permission: string | null | undefined): Role[] {
  if (!permission || !(PERMISSIONS as readonly string[]).includes(permission)) return [...ROLES];
  return ROLES.filter((r) => can(r, permission as Permission));
}

/** Mostly a role that may use the handler (so validation is reached), now and then another, or none. */
export function authArb(permission: string | null | undefined, tokens: Record<Role, string>) {
  const allowed = allowedRoles(permission);
  return fc.oneof(
    { weight: 8, arbitrary: fc.constantFrom(...(allowed.length ? allowed : ROLES)).map((r) => `Bearer ${tokens[r]}`) },
    { weight: 1, arbitrary: fc.constantFrom(...ROLES).map((r) => `Bearer ${tokens[r]}`) },
    { weight: 1, arbitrary: fc.oneof(fc.constant(""), fc.string({ maxLength: 40 }).map((s) => `Bearer ${s}`), fc.constant("Bearer ow_forged"), fc.constant("Basic YWRtaW46YWRtaW4=")) },
  );
}

/** A 2xx, or a 4xx with `{"error":{"code","message","details"}}`. */
export async function expectClientAnswer(res: Response, what: string) {
  const status = res.status;
  if (status >= 500) expect.fail(`${what} → ${status}: ${await res.text()}`);
  if (status >= 400) {
    const body = await res.json().catch(() => null);
    expect(body, `${what}: ${status} without the JSON error shape`).toMatchObject({ error: { code: expect.any(String), message: expect.any(String) } });
    expect(body.error, what).toHaveProperty("details");
  } else {
    expect(status, what).toBeGreaterThanOrEqual(200);
  }
}
