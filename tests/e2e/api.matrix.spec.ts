import fs from "node:fs";
import { expect, test } from "@playwright/test";
import { ROUTE_MATRIX, WHO, type Who } from "../matrix/routes";
import { createTokenWithCli, USERS } from "./support";

// Every route handler as every role, with bearer tokens made by the operators' CLI.
const tokens: Partial<Record<Who, string>> = {};
let ovenId = 0;
let lineId = 0;

test.beforeAll(async ({ request }) => {
  for (const role of Object.keys(USERS) as (keyof typeof USERS)[]) tokens[role] = createTokenWithCli(USERS[role], `matrix-${role}`);
  const res = await request.get("/api/v1/ovens", { headers: { authorization: `Bearer ${tokens.viewer}` } });
  const body = await res.json();
  const target = body.items.find((o: { tag: string }) => o.tag === "LAB-B2");
  ovenId = target.id;
  lineId = target.line.id;
});

for (const route of ROUTE_MATRIX) {
  for (const who of WHO) {
    const expected = route.expect[who];
    test(`${route.method} ${typeof route.path === "string" ? route.path : route.path({ ovenId: 0, unique: "x" })} as ${who} → ${expected}`, async ({ request }) => {
      const unique = `${who.slice(0, 3).toUpperCase()}${Date.now().toString(36).slice(-5).toUpperCase()}`;
      const ctx = { ovenId, unique, lineId };
      const path = typeof route.path === "string" ? route.path : route.path(ctx);
      const headers: Record<string, string> = who === "anonymous" ? {} : { authorization: `Bearer ${tokens[who]}` };
      const multipart = route.multipart
        ? { file: { name: "generic-8ch.csv", mimeType: "text/csv", buffer: fs.readFileSync("tests/fixtures/logger-files/generic-8ch.csv") } }
        : undefined;
      const res = await request.fetch(path, { method: route.method, headers, data: route.body ? route.body(ctx) : undefined, multipart });
      expect(res.status(), await res.text()).toBe(expected);
      if (expected >= 400) {
        const body = await res.json();
        expect(body.error.code).toBe({ 401: "unauthorized", 403: "forbidden", 404: "not_found" }[expected as 401 | 403 | 404] ?? body.error.code);
        expect(typeof body.error.message).toBe("string");
      }
    });
  }
}
