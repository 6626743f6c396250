import fs from "node:fs";
import { expect, test } from "@playwright/test";
import { ROUTE_MATRIX, WHO, type MatrixIds, type Who } from "../matrix/routes";
import { createTokenWithCli, USERS } from "./support";

// Every route handler as every role, with bearer tokens made by the operators' CLI.
const tokens: Partial<Record<Who, string>> = {};
let ovenId = 0;
let lineId = 0;
let ids: MatrixIds;
let workOrderId = 0;
let planId = 0;
let attachmentId = 0;
const PNG = fs.readFileSync("tests/fixtures/checklist-photo.png");

test.beforeAll(async ({ request }) => {
  for (const role of Object.keys(USERS) as (keyof typeof USERS)[]) tokens[role] = createTokenWithCli(USERS[role], `matrix-${role}`);
  const res = await request.get("/api/v1/ovens", { headers: { authorization: `Bearer ${tokens.viewer}` } });
  const body = await res.json();
  const target = body.items.find((o: { tag: string }) => o.tag === "LAB-B2");
  ovenId = target.id;
  lineId = target.line.id;
  // Seeded records for the routes that act on one: the newest run keeps its file; older ones may be deleted.
  const get = async (path: string) => (await request.get(path, { headers: { authorization: `Bearer ${tokens.viewer}` } })).json();
  const runs = (await get(`/api/v1/runs?ovenId=${ovenId}&pageSize=20&sort=-runAt`)).items as { id: number }[];
  const instruments = (await get("/api/v1/instruments")).items as { id: number; kind: string }[];
  const calibrated = await Promise.all(instruments.map(async (i) => ({ i, cals: (await get(`/api/v1/instruments/${i.id}/calibrations`)).items as { id: number; certificate: boolean }[] })));
  ids = {
    runId: runs[0].id,
    deletableRunIds: runs.slice(10).map((r) => r.id),
    windowId: (await get("/api/v1/windows")).items[0].id,
    boardId: (await get("/api/v1/boards")).items[0].id,
    instrumentId: instruments.find((i) => i.kind === "logger")!.id,
    certificateCalibrationId: calibrated.flatMap((x) => x.cals).find((c) => c.certificate)!.id,
  };
  const viewer = { authorization: `Bearer ${tokens.viewer}` };
  const orders = await (await request.get(`/api/v1/work-orders?ovenId=${ovenId}&state=open&limit=1`, { headers: viewer })).json();
  workOrderId = orders.items[0].id;
  planId = (await (await request.get(`/api/v1/plans?ovenId=${ovenId}`, { headers: viewer })).json()).items[0].id;
  const up = await request.post(`/api/v1/work-orders/${workOrderId}/attachments`, {
    headers: { authorization: `Bearer ${tokens.technician}` },
    multipart: { file: { name: "matrix.png", mimeType: "image/png", buffer: PNG } },
  });
  attachmentId = (await up.json()).id;
});

for (const route of ROUTE_MATRIX) {
  for (const who of WHO) {
    const expected = route.expect[who];
    const placeholderIds = { runId: 0, deletableRunIds: [0, 0, 0, 0, 0, 0], windowId: 0, boardId: 0, instrumentId: 0, certificateCalibrationId: 0 };
    test(`${route.method} ${typeof route.path === "string" ? route.path : route.path({ ovenId: 0, unique: "x", lineId: 0, who, ids: placeholderIds, workOrderId: 0, planId: 0, attachmentId: 0, get: async () => ({}) })} as ${who} → ${expected}`, async ({ request }) => {
      const unique = `${who.slice(0, 3).toUpperCase()}${Date.now().toString(36).slice(-5).toUpperCase()}`;
      const get = async (p: string) => (await request.get(p, { headers: { authorization: `Bearer ${tokens.viewer}` } })).json();
      const ctx = { ovenId, unique, lineId, who, ids, workOrderId, planId, attachmentId, get };
      const path = typeof route.path === "string" ? route.path : route.path(ctx);
      const headers: Record<string, string> = who === "anonymous" ? {} : { authorization: `Bearer ${tokens[who]}` };
      const multipart =
        route.multipart === "png"
          ? { file: { name: "photo.png", mimeType: "image/png", buffer: PNG } }
          : route.multipart === "logger-file"
            ? { file: { name: "generic-8ch.csv", mimeType: "text/csv", buffer: fs.readFileSync("tests/fixtures/logger-files/generic-8ch.csv") } }
            : undefined;
      const res = await request.fetch(path, { method: route.method, headers, data: route.body && !multipart ? await route.body(ctx) : undefined, multipart });
      expect(res.status(), await res.text()).toBe(expected);
      if (expected >= 400) {
        const body = await res.json();
        expect(body.error.code).toBe({ 401: "unauthorized", 403: "forbidden", 404: "not_found" }[expected as 401 | 403 | 404] ?? body.error.code);
        expect(typeof body.error.message).toBe("string");
      }
    });
  }
}
