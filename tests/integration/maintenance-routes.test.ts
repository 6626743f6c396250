import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { and, eq } from "drizzle-orm";
import { createTestDb } from "./test-db";
import { createApiToken } from "@/db/queries/api-tokens";
import { getUserByEmail } from "@/db/queries/users";
import { ovens } from "@/db/schema/fleet";
import { workOrders } from "@/db/schema/maintenance";
import type { Role } from "@/db/schema/users";

// The real route handlers, called with bearer tokens against a real database: the role checks
// the brief asks for (a viewer cannot close, a technician cannot edit plans) and the HTTP shapes.
// Only the cookie path needs the sign-in library; these calls all carry bearer tokens.
vi.mock("@/lib/auth", () => ({ auth: async () => null }));

let t: Awaited<ReturnType<typeof createTestDb>>;
const tokens = {} as Record<Role, string>;
let workOrdersRoute: typeof import("@/app/api/v1/work-orders/[workOrderId]/route");
let plansRoute: typeof import("@/app/api/v1/plans/route");
let listRoute: typeof import("@/app/api/v1/work-orders/route");

beforeAll(async () => {
  t = await createTestDb();
  process.env.DATABASE_URL = t.url;
  for (const role of ["viewer", "technician", "engineer", "manager", "admin"] as Role[]) {
    const u = await getUserByEmail(t.db, role === "technician" ? "tech@brightwater.example" : `${role}@brightwater.example`);
    tokens[role] = (await createApiToken(t.db, { userId: u!.id, name: `routes-${role}` }, null)).secret;
  }
  workOrdersRoute = await import("@/app/api/v1/work-orders/[workOrderId]/route");
  plansRoute = await import("@/app/api/v1/plans/route");
  listRoute = await import("@/app/api/v1/work-orders/route");
});
afterAll(() => t.close());

const call = (handler: (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>, role: Role, method: string, url: string, body?: unknown, params: Record<string, string> = {}) =>
  handler(
    new Request(`http://localhost${url}`, { method, headers: { authorization: `Bearer ${tokens[role]}`, "content-type": "application/json" }, body: body ? JSON.stringify(body) : undefined }),
    { params: Promise.resolve(params) },
  );

async function openOrder() {
  const [o] = await t.db.select().from(workOrders).where(and(eq(workOrders.state, "open"), eq(workOrders.kind, "preventive"))).limit(1);
  return o;
}

describe("maintenance routes enforce roles on the server", () => {
  it("a viewer cannot close a work order (403), a technician can (200 with the new version)", async () => {
    const o = await openOrder();
    const results = Object.fromEntries(o.checklist.map((c) => [c.id, { ok: true }]));
    const body = { version: o.version, state: "done", checklistResults: results };
    const denied = await call(workOrdersRoute.PATCH as never, "viewer", "PATCH", `/api/v1/work-orders/${o.id}`, body, { workOrderId: String(o.id) });
    expect(denied.status).toBe(403);
    expect((await denied.json()).error.code).toBe("forbidden");
    const ok = await call(workOrdersRoute.PATCH as never, "technician", "PATCH", `/api/v1/work-orders/${o.id}`, body, { workOrderId: String(o.id) });
    expect(ok.status).toBe(200);
    expect(await ok.json()).toMatchObject({ state: "done", version: o.version + 1 });
    const stale = await call(workOrdersRoute.PATCH as never, "technician", "PATCH", `/api/v1/work-orders/${o.id}`, { version: o.version, notes: "late edit" }, { workOrderId: String(o.id) });
    expect(stale.status).toBe(409);
    const err = (await stale.json()).error;
    expect(err.code).toBe("conflict");
    expect(err.details.current.version).toBe(o.version + 1);
  });

  it("a technician cannot create plans (403); an engineer can (201)", async () => {
    const [oven] = await t.db.select().from(ovens).limit(1);
    const body = { ovenIds: [oven.id], title: "Route plan", rrule: "FREQ=DAILY", dtstart: "2026-06-01T06:00" };
    expect((await call(plansRoute.POST as never, "technician", "POST", "/api/v1/plans", body)).status).toBe(403);
    const created = await call(plansRoute.POST as never, "engineer", "POST", "/api/v1/plans", body);
    expect(created.status).toBe(201);
    expect((await created.json()).items[0]).toMatchObject({ title: "Route plan", rrule: "FREQ=DAILY", dtstart: "2026-06-01T06:00" });
  });

  it("lists orders in the contract's shape with a total", async () => {
    const res = await call(listRoute.GET as never, "viewer", "GET", "/api/v1/work-orders?state=open&limit=5");
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.items).toHaveLength(5);
    expect(body.total).toBeGreaterThan(5);
    for (const item of body.items) {
      expect(Object.keys(item)).toEqual(expect.arrayContaining(["id", "number", "planId", "ovenId", "kind", "state", "dueAt", "assigneeId", "version"]));
      expect(item.dueAt).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/);
      expect(item.state).toBe("open");
    }
  });

  it("answers a bad filter with 400 naming the field", async () => {
    const res = await call(listRoute.GET as never, "viewer", "GET", "/api/v1/work-orders?state=finished");
    expect(res.status).toBe(400);
    expect(Object.keys((await res.json()).error.details.fields)).toEqual(["state"]);
  });
});
