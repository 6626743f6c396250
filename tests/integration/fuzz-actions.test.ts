import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import type { AddressInfo } from "node:net";
import { ACTION_REGISTRY } from "@/lib/action";
import { invokeAction } from "@/lib/action-invoke";
import type { Actor } from "@/lib/actor";
import { ROLES, type Role } from "@/db/schema/users";
import { startMailSink } from "@/lib/mail-sink";
import { ACTION_INPUTS } from "../matrix/actions";
import { loadAllActionDefinitions } from "../matrix/load-actions";
import { actorFor, createTestDb } from "./test-db";
import { claimedType, fileBytes, hostileFileName, hostileString, jsonValue, POLLUTION_KEYS, schemaVocabulary, toFormValue } from "./fuzz/arbitraries";
import { allowedRoles } from "./fuzz/requests";

// Every server action definition, invoked the way a form's "use server" function invokes it
// (invokeAction with FormData), with the matrix's valid input mutated and random fields added.
// The answer must be success or an error the form can show; never "internal", never a throw.
const current: { actor: Actor | null } = { actor: null };
vi.mock("@/lib/session", () => ({ getActor: async () => current.actor })); // the request's actor, chosen per run

const RUNS = Number(process.env.FUZZ_RUNS ?? 40);
const EXPECTED = ["invalid_input", "forbidden", "not_found", "conflict", "unauthorized", "invalid_file", "file_too_large", "unsupported_file", "rate_limited"];
await loadAllActionDefinitions();

let t: Awaited<ReturnType<typeof createTestDb>>;
let sink: Awaited<ReturnType<typeof startMailSink>>;
let uploadDir: string;
let vocab: Awaited<ReturnType<typeof schemaVocabulary>>;
const actors = {} as Record<Role, Actor>;
const valid = new Map<string, { role: Role; input: Record<string, unknown> }>();
/** A role that holds the permission (not admin when another will do), so validation is reached. */
const fuzzRole = (permission: string): Role => {
  const allowed = allowedRoles(permission);
  return allowed.find((r) => r !== "admin") ?? allowed[0] ?? "admin";
};
const loggerSamples = [new Uint8Array(fs.readFileSync(path.resolve(__dirname, "../fixtures/logger-files/generic-8ch.csv")))];
const prototypeBefore = Object.getOwnPropertyNames(Object.prototype).sort();

beforeAll(async () => {
  t = await createTestDb();
  // Invitations are mailed at once: a real sink on a free port of its own catches them.
  sink = await startMailSink({ db: t.db, port: 0 });
  const port = (sink.server.address() as AddressInfo).port;
  uploadDir = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-fuzz-actions-"));
  Object.assign(process.env, { DATABASE_URL: t.url, UPLOAD_DIR: uploadDir, SMTP_URL: `smtp://127.0.0.1:${port}` });
  for (const role of ROLES) actors[role] = await actorFor(t.db, role);
  vocab = await schemaVocabulary();
  // Every valid input is made before any fuzzing: a fuzzed edit may rename the oven they look up.
  for (const [name, make] of Object.entries(ACTION_INPUTS)) {
    const role = fuzzRole(ACTION_REGISTRY.get(name)!.permission);
    valid.set(name, { role, input: await make(t.db, role) });
  }
});
afterAll(() => {
  sink?.close();
  t?.close();
  fs.rmSync(uploadDir, { recursive: true, force: true });
});

type Field = [string, string | { fileName: string; bytes: Uint8Array; type: string }];

function formArb(valid: Record<string, unknown>) {
  const { value, key } = jsonValue(vocab);
  const file = fc.record({ fileName: hostileFileName, bytes: fileBytes(loggerSamples), type: claimedType });
  const anyValue = fc.oneof({ weight: 3, arbitrary: hostileString }, { weight: 2, arbitrary: value.map(toFormValue) }, { weight: 1, arbitrary: file });
  const kept = Object.entries(valid).map(([k, v]) =>
    fc.oneof(
      { weight: 10, arbitrary: fc.constant([[k, String(v)]] as Field[]) },
      { weight: 2, arbitrary: anyValue.map((x) => [[k, x]] as Field[]) },
      { weight: 1, arbitrary: fc.constant([] as Field[]) },
      { weight: 1, arbitrary: fc.tuple(anyValue, anyValue).map(([a, b]) => [[k, a], [k, b]] as Field[]) }, // the same name twice
    ),
  );
  const extra = fc.array(fc.tuple(fc.oneof(key, fc.constantFrom(...POLLUTION_KEYS, "$ACTION_ID_x", "attachment")), anyValue), { maxLength: 3 });
  return fc.tuple(fc.tuple(...kept), extra).map(([k, e]) => [...k.flat(), ...e] as Field[]);
}

function toFormData(fields: Field[]): FormData {
  const form = new FormData();
  for (const [k, v] of fields) form.append(k, typeof v === "string" ? v : new File([v.bytes as BlobPart], v.fileName, { type: v.type }));
  return form;
}

describe("fuzzed server actions answer with a result the form can show", () => {
  it("covers every registered action", () => {
    expect([...ACTION_REGISTRY.keys()].sort()).toEqual(Object.keys(ACTION_INPUTS).sort());
  });

  for (const name of Object.keys(ACTION_INPUTS)) {
    it(name, async () => {
      const def = ACTION_REGISTRY.get(name)!;
      const { role, input } = valid.get(name)!;
      const who = fc.oneof({ weight: 8, arbitrary: fc.constant<Role | null>(role) }, { weight: 1, arbitrary: fc.constantFrom<Role | null>(...ROLES) }, { weight: 1, arbitrary: fc.constant<Role | null>(null) });
      await fc.assert(
        fc.asyncProperty(formArb(input), who, async (fields, r) => {
          current.actor = r ? actors[r] : null;
          const spy = vi.spyOn(console, "error").mockImplementation(() => {});
          let loggedCalls: unknown[][] = [];
          const result = await invokeAction(def, toFormData(fields)).finally(() => {
            loggedCalls = [...spy.mock.calls];
            spy.mockRestore();
          });
          if (!result.ok) {
            // An "internal" answer carries the server's logged error into the report, so a rare failure says why.
            const cause = result.code === "internal" ? ` (logged: ${loggedCalls.map((c) => c.map((x) => (x instanceof Error ? `${x.cause ? `${String(x.cause)} — ` : ""}${x.message}` : String(x))).join(" ")).join("; ").slice(0, 600)})` : "";
            expect(EXPECTED, `${name} as ${r}: ${result.code} ${result.message}${cause} for ${JSON.stringify(fields.map(([k, v]) => [k, typeof v === "string" ? v.slice(0, 80) : `file ${v.fileName}`]))}`).toContain(result.code);
            expect(typeof result.message).toBe("string");
          }
        }),
        { numRuns: RUNS },
      );
    }, 30_000 + RUNS * 400);
  }

  it("no input polluted Object.prototype", () => {
    expect(Object.getOwnPropertyNames(Object.prototype).sort()).toEqual(prototypeBefore);
  });
});
