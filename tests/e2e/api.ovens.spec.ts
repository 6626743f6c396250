import { expect, test } from "@playwright/test";
import { createTokenWithCli, USERS } from "./support";

// The foundation's API contract: validation errors name the field, duplicates are 409,
// and a revoked token stops working at once.
let engineer = "";
let lineId = 0;

test.beforeAll(async ({ request }) => {
  engineer = createTokenWithCli(USERS.engineer, "contract-engineer");
  const body = await (await request.get("/api/v1/ovens", { headers: { authorization: `Bearer ${engineer}` } })).json();
  lineId = body.items[0].line.id;
});

const auth = () => ({ authorization: `Bearer ${engineer}` });

test("a body without tag is a 400 naming tag", async ({ request }) => {
  const res = await request.post("/api/v1/ovens", { headers: auth(), data: { name: "No tag", lineId, kind: "convection" } });
  expect(res.status()).toBe(400);
  const body = await res.json();
  expect(body.error.code).toBe("invalid_input");
  expect(Object.keys(body.error.details.fields)).toEqual(["tag"]);
  expect(body.error.message).toContain("tag");
});

test("a duplicate tag is a 409 conflict", async ({ request }) => {
  const res = await request.post("/api/v1/ovens", { headers: auth(), data: { tag: "l1-rf1", name: "Again", lineId, kind: "convection" } });
  expect(res.status()).toBe(409);
  expect((await res.json()).error.code).toBe("conflict");
});

test("broken JSON, an unknown line and an unknown oven answer 4xx JSON", async ({ request }) => {
  const broken = await request.post("/api/v1/ovens", { headers: { ...auth(), "content-type": "application/json" }, data: "{not json" });
  expect(broken.status()).toBe(400);
  const line = await request.post("/api/v1/ovens", { headers: auth(), data: { tag: "NOLINE-1", name: "x", lineId: 99999, kind: "convection" } });
  expect(line.status()).toBe(400);
  expect((await line.json()).error.details.fields.lineId).toBeTruthy();
  const missing = await request.get("/api/v1/ovens/99999", { headers: auth() });
  expect(missing.status()).toBe(404);
  expect((await missing.json()).error.code).toBe("not_found");
});

test("an engineer may not retire an oven; PATCH keeps other fields", async ({ request }) => {
  const created = await request.post("/api/v1/ovens", { headers: auth(), data: { tag: "RET-1", name: "To retire", lineId, kind: "other" } });
  expect(created.status()).toBe(201);
  const { id } = await created.json();
  const retire = await request.patch(`/api/v1/ovens/${id}`, { headers: auth(), data: { serviceState: "retired" } });
  expect(retire.status()).toBe(403);
  const down = await request.patch(`/api/v1/ovens/${id}`, { headers: auth(), data: { serviceState: "down" } });
  expect(down.status()).toBe(200);
  const after = await down.json();
  expect(after.serviceState).toBe("down");
  expect(after.name).toBe("To retire");
});

test("GET /api/v1/me answers for the token's user", async ({ request }) => {
  const me = await (await request.get("/api/v1/me", { headers: auth() })).json();
  expect(me).toMatchObject({ email: USERS.engineer, role: "engineer", via: "token" });
});
