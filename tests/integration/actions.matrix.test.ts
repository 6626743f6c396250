import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ACTION_REGISTRY, runAction } from "@/lib/action";
import { ROLES, type Role } from "@/db/schema/users";
import { can } from "@/lib/permissions";
import { ACTION_INPUTS } from "../matrix/actions";
import { actorFor, createTestDb } from "./test-db";
import { startMailSink } from "@/lib/mail-sink";
import { loadAllActionDefinitions } from "../matrix/load-actions";

// Every definition file in lib/actions/, so a new one cannot be left out of the matrix.
await loadAllActionDefinitions();

// The role × server-action matrix: every registered action, as every role, against a real database.
let t: Awaited<ReturnType<typeof createTestDb>>;
let sink: Awaited<ReturnType<typeof startMailSink>>;
beforeAll(async () => {
  t = await createTestDb();
  sink = await startMailSink({ db: t.db, port: Number(process.env.SMTP_SINK_PORT) });
});
afterAll(() => {
  sink.close();
  t.close();
});

describe("every server action checks its permission on the server", () => {
  it("has input for every registered action", () => {
    expect([...ACTION_REGISTRY.keys()].sort()).toEqual(Object.keys(ACTION_INPUTS).sort());
  });

  for (const [name, makeInput] of Object.entries(ACTION_INPUTS)) {
    for (const role of ROLES) {
      it(`${name} as ${role}`, async () => {
        const def = ACTION_REGISTRY.get(name)!;
        const actor = await actorFor(t.db, role as Role);
        const result = await runAction(def, actor, await makeInput(t.db, role), t.db);
        if (can(role, def.permission)) {
          expect(result, JSON.stringify(result)).toMatchObject({ ok: true });
        } else {
          expect(result).toMatchObject({ ok: false, code: "forbidden" });
        }
      });
    }
  }

  it("refuses an anonymous caller", async () => {
    for (const def of ACTION_REGISTRY.values()) {
      expect(await runAction(def, null, {}, t.db)).toMatchObject({ ok: false, code: "unauthorized" });
    }
  });
});
