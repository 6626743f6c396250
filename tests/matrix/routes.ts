// The role × route matrix: every route handler the app has, and the status each role must get.
// tests/unit/security/coverage.test.ts fails when a route exists that is not listed here;
// tests/e2e/api.matrix.spec.ts calls each one over HTTP as every role.
export type Who = "anonymous" | "viewer" | "technician" | "engineer" | "manager" | "admin";
export const WHO: Who[] = ["anonymous", "viewer", "technician", "engineer", "manager", "admin"];

/** Seeded records the spec looks up before calling the routes (see api.matrix.spec.ts). */
export type MatrixIds = { runId: number; deletableRunIds: number[]; windowId: number; boardId: number; instrumentId: number; certificateCalibrationId: number };
export type MatrixCtx = {
  ovenId: number;
  unique: string;
  lineId: number;
  who: Who;
  ids: MatrixIds;
  /** An unfinished work order of LAB-B2, and one of its attachments. */
  workOrderId: number;
  attachmentId: number;
  planId: number;
  /** GET as the viewer (for bodies that need the current version of a record). */
  get: (path: string) => Promise<Record<string, unknown>>;
};

export type RouteCase = {
  method: "GET" | "POST" | "PATCH" | "PUT" | "DELETE";
  /** The file under app/ that handles it. */
  file: string;
  path: string | ((ctx: MatrixCtx) => string);
  body?: (ctx: MatrixCtx) => unknown | Promise<unknown>;
  /** "png": a multipart form with a tiny PNG in the field "file". */
  multipart?: "logger-file" | "png";
  expect: Record<Who, number>;
};

const all = (ok: number): Record<Who, number> => ({ anonymous: 401, viewer: ok, technician: ok, engineer: ok, manager: ok, admin: ok });
const adminOnly = (ok: number): Record<Who, number> => ({ anonymous: 401, viewer: 403, technician: 403, engineer: 403, manager: 403, admin: ok });
const everyone = (status: number): Record<Who, number> => ({ anonymous: status, viewer: status, technician: status, engineer: status, manager: status, admin: status });
const technicianUp = (ok: number): Record<Who, number> => ({ anonymous: 401, viewer: 403, technician: ok, engineer: ok, manager: ok, admin: ok });
const floor = (ok: number): Record<Who, number> => ({ anonymous: 401, viewer: 403, technician: ok, engineer: ok, manager: ok, admin: 403 });
const planners = (ok: number): Record<Who, number> => ({ anonymous: 401, viewer: 403, technician: 403, engineer: ok, manager: ok, admin: 403 });
const engineerUp = (ok: number): Record<Who, number> => ({ anonymous: 401, viewer: 403, technician: 403, engineer: ok, manager: ok, admin: ok });

const SAC305 = {
  liquidus: 217, peakMin: 235, peakMax: 245, talMin: 50, talMax: 70, soakStart: 150, soakEnd: 200, soakMin: 60, soakMax: 120,
  rampUpMax: 3, rampDownMax: 4, rampWindow: 10, heatUpFrom: 50, heatUpTo: 150, deltaTMax: 10, timeToPeakMax: 480,
};
const v1 = "app/api/v1";
// Verification runs, process windows, test boards, instruments and calibrations.
const RUN_ROUTES: RouteCase[] = [
  { method: "POST", file: `${v1}/ovens/[ovenId]/runs/route.ts`, path: ({ ovenId }) => `/api/v1/ovens/${ovenId}/runs`, multipart: "logger-file", expect: technicianUp(201) },
  { method: "POST", file: `${v1}/ovens/[ovenId]/runs/preview/route.ts`, path: ({ ovenId }) => `/api/v1/ovens/${ovenId}/runs/preview`, multipart: "logger-file", expect: technicianUp(200) },
  { method: "GET", file: `${v1}/runs/route.ts`, path: ({ ovenId }) => `/api/v1/runs?ovenId=${ovenId}&verdict=pass&pageSize=5`, expect: all(200) },
  { method: "GET", file: `${v1}/runs/export.csv/route.ts`, path: ({ ovenId }) => `/api/v1/runs/export.csv?ovenId=${ovenId}`, expect: all(200) },
  { method: "GET", file: `${v1}/runs/[runId]/route.ts`, path: ({ ids }) => `/api/v1/runs/${ids.runId}`, expect: all(200) },
  { method: "GET", file: `${v1}/runs/[runId]/file/route.ts`, path: ({ ids }) => `/api/v1/runs/${ids.runId}/file`, expect: all(200) },
  { method: "POST", file: `${v1}/runs/[runId]/rejudge/route.ts`, path: ({ ids }) => `/api/v1/runs/${ids.runId}/rejudge`, body: () => ({}), expect: engineerUp(201) },
  { method: "DELETE", file: `${v1}/runs/[runId]/route.ts`, path: ({ ids, who }) => `/api/v1/runs/${ids.deletableRunIds[WHO.indexOf(who)]}`, expect: engineerUp(200) },
  { method: "GET", file: `${v1}/windows/route.ts`, path: "/api/v1/windows", expect: all(200) },
  { method: "POST", file: `${v1}/windows/route.ts`, path: "/api/v1/windows", body: ({ unique }) => ({ name: `W-${unique}`, presetId: "sac305-typical", values: SAC305 }), expect: engineerUp(201) },
  { method: "GET", file: `${v1}/windows/[windowId]/route.ts`, path: ({ ids }) => `/api/v1/windows/${ids.windowId}`, expect: all(200) },
  { method: "PATCH", file: `${v1}/windows/[windowId]/route.ts`, path: ({ ids }) => `/api/v1/windows/${ids.windowId}`, body: ({ unique }) => ({ notes: `matrix ${unique}` }), expect: engineerUp(200) },
  { method: "GET", file: `${v1}/boards/route.ts`, path: "/api/v1/boards", expect: all(200) },
  {
    method: "POST", file: `${v1}/boards/route.ts`, path: "/api/v1/boards",
    body: ({ unique }) => ({ name: `B-${unique}`, widthMm: 100, heightMm: 80, probes: [{ label: "P1", x: 10, y: 10, sitsOn: "edge" }] }), expect: engineerUp(201),
  },
  { method: "GET", file: `${v1}/boards/[boardId]/route.ts`, path: ({ ids }) => `/api/v1/boards/${ids.boardId}`, expect: all(200) },
  { method: "PATCH", file: `${v1}/boards/[boardId]/route.ts`, path: ({ ids }) => `/api/v1/boards/${ids.boardId}`, body: ({ unique }) => ({ notes: `matrix ${unique}` }), expect: engineerUp(200) },
  { method: "GET", file: `${v1}/instruments/route.ts`, path: "/api/v1/instruments", expect: all(200) },
  { method: "POST", file: `${v1}/instruments/route.ts`, path: "/api/v1/instruments", body: ({ unique }) => ({ kind: "logger", name: `I-${unique}`, serial: `S-${unique}`, channelCount: 8 }), expect: engineerUp(201) },
  { method: "GET", file: `${v1}/instruments/[instrumentId]/route.ts`, path: ({ ids }) => `/api/v1/instruments/${ids.instrumentId}`, expect: all(200) },
  { method: "PATCH", file: `${v1}/instruments/[instrumentId]/route.ts`, path: ({ ids }) => `/api/v1/instruments/${ids.instrumentId}`, body: ({ unique }) => ({ notes: `matrix ${unique}` }), expect: engineerUp(200) },
  { method: "GET", file: `${v1}/instruments/[instrumentId]/calibrations/route.ts`, path: ({ ids }) => `/api/v1/instruments/${ids.instrumentId}/calibrations`, expect: all(200) },
  {
    method: "POST", file: `${v1}/instruments/[instrumentId]/calibrations/route.ts`, path: ({ ids }) => `/api/v1/instruments/${ids.instrumentId}/calibrations`,
    body: () => ({ performedAt: "2026-01-10", performedBy: "Matrix Metrology", reference: "dry-well", offsets: { "1": 0.1 } }), expect: engineerUp(201),
  },
  { method: "GET", file: `${v1}/calibrations/[calibrationId]/certificate/route.ts`, path: ({ ids }) => `/api/v1/calibrations/${ids.certificateCalibrationId}/certificate`, expect: all(200) },
];

export const ROUTE_MATRIX: RouteCase[] = [
  { method: "GET", file: "app/api/health/route.ts", path: "/api/health", expect: { anonymous: 200, viewer: 200, technician: 200, engineer: 200, manager: 200, admin: 200 } },
  { method: "GET", file: "app/api/v1/me/route.ts", path: "/api/v1/me", expect: all(200) },
  { method: "GET", file: "app/api/v1/ovens/route.ts", path: "/api/v1/ovens", expect: all(200) },
  {
    method: "POST",
    file: "app/api/v1/ovens/route.ts",
    path: "/api/v1/ovens",
    body: ({ unique, lineId }) => ({ tag: `M-${unique}`, name: "Matrix oven", lineId, kind: "convection", zones: 8 }),
    expect: engineerUp(201),
  },
  { method: "GET", file: "app/api/v1/ovens/[ovenId]/route.ts", path: ({ ovenId }) => `/api/v1/ovens/${ovenId}`, expect: all(200) },
  {
    method: "PATCH",
    file: "app/api/v1/ovens/[ovenId]/route.ts",
    path: ({ ovenId }) => `/api/v1/ovens/${ovenId}`,
    body: ({ unique }) => ({ notes: `matrix ${unique}` }),
    expect: engineerUp(200),
  },
  {
    method: "POST",
    file: "app/api/v1/profiles/analyze/route.ts",
    path: "/api/v1/profiles/analyze",
    multipart: "logger-file",
    expect: all(200),
  },
  { method: "GET", file: "app/api/v1/changes/route.ts", path: "/api/v1/changes", expect: all(200) },
  { method: "GET", file: "app/api/v1/ovens/[ovenId]/changes/route.ts", path: ({ ovenId }) => `/api/v1/ovens/${ovenId}/changes`, expect: all(200) },
  {
    method: "POST",
    file: "app/api/v1/ovens/[ovenId]/changes/route.ts",
    path: ({ ovenId }) => `/api/v1/ovens/${ovenId}/changes`,
    body: ({ unique }) => ({ at: new Date(Date.now() - 60_000).toISOString(), area: "controller_firmware", summary: `Matrix firmware ${unique}`, before: "2.3.1", after: "2.4.0" }),
    expect: { anonymous: 401, viewer: 403, technician: 403, engineer: 201, manager: 403, admin: 403 },
  },
  { method: "GET", file: "app/api/v1/outbox/route.ts", path: "/api/v1/outbox?state=sent", expect: adminOnly(200) },
  // No user behind these: API tokens are not the cron secret (401 for all; tests/e2e/api.mail.spec.ts
  // calls it with the secret), and an unsubscribe POST without its signed token is a 400.
  { method: "POST", file: "app/api/cron/tick/route.ts", path: "/api/cron/tick", expect: everyone(401) },
  { method: "POST", file: "app/api/unsubscribe/route.ts", path: "/api/unsubscribe", expect: everyone(400) },
  { method: "GET", file: "app/(app)/dev/mail/preview/[template]/route.ts", path: "/dev/mail/preview/fleet-digest", expect: adminOnly(200) },
  ...RUN_ROUTES,
  { method: "GET", file: "app/api/v1/plans/route.ts", path: "/api/v1/plans", expect: all(200) },
  {
    method: "POST",
    file: "app/api/v1/plans/route.ts",
    path: "/api/v1/plans",
    body: ({ ovenId, unique }) => ({
      ovenIds: [ovenId], title: `Matrix plan ${unique}`, kind: "preventive", rrule: "FREQ=MONTHLY;BYMONTHDAY=3", dtstart: "2026-01-03T07:00",
      checklist: [{ id: "a", label: "Checked", mandatory: true }], estimatedMinutes: 10,
    }),
    expect: planners(201),
  },
  { method: "GET", file: "app/api/v1/plans/[planId]/route.ts", path: ({ planId }) => `/api/v1/plans/${planId}`, expect: all(200) },
  {
    method: "PATCH",
    file: "app/api/v1/plans/[planId]/route.ts",
    path: ({ planId }) => `/api/v1/plans/${planId}`,
    body: async ({ planId, get }) => ({ version: (await get(`/api/v1/plans/${planId}`)).version, estimatedMinutes: 25 }),
    expect: planners(200),
  },
  {
    method: "POST",
    file: "app/api/v1/maintenance/generate/route.ts",
    path: "/api/v1/maintenance/generate",
    body: () => ({}),
    expect: { anonymous: 401, viewer: 403, technician: 403, engineer: 403, manager: 200, admin: 200 },
  },
  { method: "GET", file: "app/api/v1/work-orders/route.ts", path: ({ ovenId }) => `/api/v1/work-orders?ovenId=${ovenId}&overdue=true`, expect: all(200) },
  {
    method: "POST",
    file: "app/api/v1/work-orders/route.ts",
    path: "/api/v1/work-orders",
    body: ({ ovenId, unique }) => ({ ovenId, title: `Matrix repair ${unique}`, kind: "corrective" }),
    expect: floor(201),
  },
  { method: "GET", file: "app/api/v1/work-orders/export/route.ts", path: ({ ovenId }) => `/api/v1/work-orders/export?ovenId=${ovenId}`, expect: all(200) },
  { method: "GET", file: "app/api/v1/work-orders/[workOrderId]/route.ts", path: ({ workOrderId }) => `/api/v1/work-orders/${workOrderId}`, expect: all(200) },
  {
    method: "PATCH",
    file: "app/api/v1/work-orders/[workOrderId]/route.ts",
    path: ({ workOrderId }) => `/api/v1/work-orders/${workOrderId}`,
    body: async ({ workOrderId, unique, get }) => ({ version: (await get(`/api/v1/work-orders/${workOrderId}`)).version, notes: `matrix ${unique}` }),
    expect: floor(200),
  },
  {
    method: "POST",
    file: "app/api/v1/work-orders/[workOrderId]/comments/route.ts",
    path: ({ workOrderId }) => `/api/v1/work-orders/${workOrderId}/comments`,
    body: ({ unique }) => ({ body: `Checked by matrix ${unique} @tech` }),
    expect: floor(201),
  },
  {
    method: "POST",
    file: "app/api/v1/work-orders/[workOrderId]/attachments/route.ts",
    path: ({ workOrderId }) => `/api/v1/work-orders/${workOrderId}/attachments`,
    multipart: "png",
    expect: floor(201),
  },
  {
    method: "POST",
    file: "app/api/v1/work-orders/assign/route.ts",
    path: "/api/v1/work-orders/assign",
    body: ({ workOrderId }) => ({ ids: [workOrderId], assigneeId: null }),
    expect: { anonymous: 401, viewer: 403, technician: 403, engineer: 403, manager: 200, admin: 403 },
  },
  { method: "GET", file: "app/api/v1/attachments/[attachmentId]/route.ts", path: ({ attachmentId }) => `/api/v1/attachments/${attachmentId}`, expect: all(200) },
  { method: "GET", file: "app/api/v1/ovens/[ovenId]/meters/route.ts", path: ({ ovenId }) => `/api/v1/ovens/${ovenId}/meters`, expect: all(200) },
  {
    method: "POST",
    file: "app/api/v1/ovens/[ovenId]/meters/route.ts",
    path: ({ ovenId }) => `/api/v1/ovens/${ovenId}/meters`,
    // Hour meters only count up: each call sends a larger value than the last.
    body: () => ({ kind: "heater_hours", value: 100_000 + (Date.now() - 1.7e12) / 1000 }),
    expect: floor(201),
  },
];

/** Route files that are not Ovenward's API but the sign-in library's own endpoints. */
export const FRAMEWORK_ROUTES = ["app/api/auth/[...nextauth]/route.ts"];

// Drift tracking: trends, change impact, the fleet view and alerts.
ROUTE_MATRIX.push(
  { method: "GET", file: "app/api/v1/ovens/[ovenId]/trends/route.ts", path: ({ ovenId }) => `/api/v1/ovens/${ovenId}/trends?metric=deltaTPeak`, expect: all(200) },
  { method: "GET", file: "app/api/v1/changes/[changeId]/impact/route.ts", path: "/api/v1/changes/1/impact?metric=deltaTPeak", expect: all(200) }, // the seed's first change: LAB-B1's baffle
  { method: "GET", file: "app/api/v1/fleet/route.ts", path: "/api/v1/fleet", expect: all(200) },
  {
    method: "POST",
    file: "app/api/v1/changes/[changeId]/attachments/route.ts",
    path: "/api/v1/changes/1/attachments",
    multipart: "png",
    expect: { anonymous: 401, viewer: 403, technician: 403, engineer: 201, manager: 403, admin: 403 },
  },
  { method: "GET", file: "app/api/v1/change-attachments/[attachmentId]/route.ts", path: "/api/v1/change-attachments/1", expect: all(200) },
  { method: "GET", file: "app/api/v1/alerts/route.ts", path: "/api/v1/alerts?status=all", expect: all(200) },
  {
    method: "POST",
    file: "app/api/v1/alerts/[alertId]/acknowledge/route.ts",
    path: "/api/v1/alerts/999999/acknowledge",
    body: () => ({ note: "matrix check" }),
    // The role check comes before the look-up: allowed roles reach "not found", the others are refused.
    expect: { anonymous: 401, viewer: 403, technician: 404, engineer: 404, manager: 404, admin: 403 },
  },
);
