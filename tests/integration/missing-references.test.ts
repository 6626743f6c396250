import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import type { AddressInfo } from "node:net";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { ACTION_REGISTRY } from "@/lib/action";
import { invokeAction } from "@/lib/action-invoke";
import type { Actor } from "@/lib/actor";
import { startMailSink } from "@/lib/mail-sink";
import { ACTION_INPUTS } from "../matrix/actions";
import { loadAllActionDefinitions } from "../matrix/load-actions";
import { allowedRoles } from "./fuzz/requests";
import { actorFor, createTestDb } from "./test-db";

// Every server action, given its valid input with one reference (a field ending in "Id") pointing
// at a record that does not exist. The answer names the missing record (not_found) or the field
// (invalid_input); it is never a database constraint surfacing as "internal".
const current: { actor: Actor | null } = { actor: null };
vi.mock("@/lib/session", () => ({ getActor: async () => current.actor }));
await loadAllActionDefinitions();

let t: Awaited<ReturnType<typeof createTestDb>>;
let sink: Awaited<ReturnType<typeof startMailSink>>;
let uploadDir: string;
const cases: { name: string; field: string; role: string; input: Record<string, unknown> }[] = [];
const MISSING = { numeric: "987654", uuid: "00000000-0000-4000-8000-000000000000" };

beforeAll(async () => {
  t = await createTestDb();
  sink = await startMailSink({ db: t.db, port: 0 });
  uploadDir = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-missing-refs-"));
  Object.assign(process.env, { DATABASE_URL: t.url, UPLOAD_DIR: uploadDir, SMTP_URL: `smtp://127.0.0.1:${(sink.server.address() as AddressInfo).port}` });
});
afterAll(() => {
  sink?.close();
  t?.close();
  fs.rmSync(uploadDir, { recursive: true, force: true });
});

/** Each action's valid input (made for a role that may use it, not admin when another will do) and its reference fields. */
async function* referenceFields() {
  for (const [name, make] of Object.entries(ACTION_INPUTS)) {
    const def = ACTION_REGISTRY.get(name)!;
    const allowed = allowedRoles(def.permission);
    const role = allowed.find((r) => r !== "admin") ?? allowed[0];
    const valid = await make(t.db, role);
    for (const field of Object.keys(valid).filter((k) => /Id$/.test(k))) yield { name, def, allowed, role, valid, field };
  }
}
const formOf = (input: Record<string, unknown>) => {
  const form = new FormData();
  for (const [k, v] of Object.entries(input)) form.append(k, String(v));
  return form;
};

describe("a reference to a record that does not exist", () => {
  it("is answered with not_found or invalid_input by every action that takes one", async () => {
    const errors = vi.spyOn(console, "error").mockImplementation(() => {});
    const answers: string[] = [];
    for await (const { name, def, allowed, role, valid, field } of referenceFields()) {
      const missing = /^\d+$/.test(String(valid[field])) ? MISSING.numeric : MISSING.uuid;
      // As the role the input was made for, and as an admin where admins may: someone else's
      // record may be refused as forbidden to the first (saying nothing of whether it exists),
      // but an admin is told it is not there.
      for (const as of new Set([role, ...(allowed.includes("admin") ? (["admin"] as const) : [])])) {
        current.actor = await actorFor(t.db, as);
        const r = await invokeAction(def, formOf({ ...valid, [field]: missing }));
        const fine = as === "admin" ? /^(not_found|invalid_input)$/ : /^(not_found|invalid_input|forbidden)$/;
        if (r.ok || !fine.test(r.code)) answers.push(`${name}.${field} as ${as}: ${r.ok ? "ok" : r.code}`);
        cases.push({ name, field, role: as, input: valid });
      }
    }
    errors.mockRestore();
    // At least the oven, run, window, board, instrument, user and alert references are exercised.
    expect(cases.length).toBeGreaterThanOrEqual(10);
    expect(answers).toEqual([]);
  });

  it("and references to other records that do exist (ids 1 to 15) never surface as internal errors", async () => {
    const logged = vi.spyOn(console, "error").mockImplementation(() => {});
    const internal: string[] = [];
    for await (const { name, def, role, valid, field } of referenceFields()) {
      if (!/^\d+$/.test(String(valid[field]))) continue;
      for (let id = 1; id <= 15; id++) {
        current.actor = await actorFor(t.db, role);
        const before = logged.mock.calls.length;
        const r = await invokeAction(def, formOf({ ...valid, [field]: String(id) }));
        if (!r.ok && r.code === "internal") internal.push(`${name}.${field}=${id}: ${String((logged.mock.calls[before]?.[1] as Error | undefined)?.cause ?? logged.mock.calls[before]?.[1]).slice(0, 160)}`);
      }
    }
    logged.mockRestore();
    expect(internal).toEqual([]);
  });
});
