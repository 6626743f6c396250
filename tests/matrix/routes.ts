// The role × route matrix: every route handler the app has, and the status each role must get.
// tests/unit/security/coverage.test.ts fails when a route exists that is not listed here;
// tests/e2e/api.matrix.spec.ts calls each one over HTTP as every role.
export type Who = "anonymous" | "viewer" | "technician" | "engineer" | "manager" | "admin";
export const WHO: Who[] = ["anonymous", "viewer", "technician", "engineer", "manager", "admin"];

export type MatrixCtx = {
  ovenId: number;
  unique: string;
  lineId: number;
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
const floor = (ok: number): Record<Who, number> => ({ anonymous: 401, viewer: 403, technician: ok, engineer: ok, manager: ok, admin: 403 });
const planners = (ok: number): Record<Who, number> => ({ anonymous: 401, viewer: 403, technician: 403, engineer: ok, manager: ok, admin: 403 });
const engineerUp = (ok: number): Record<Who, number> => ({ anonymous: 401, viewer: 403, technician: 403, engineer: ok, manager: ok, admin: ok });

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
