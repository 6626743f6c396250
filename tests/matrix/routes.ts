// The role × route matrix: every route handler the app has, and the status each role must get.
// tests/unit/security/coverage.test.ts fails when a route exists that is not listed here;
// tests/e2e/api.matrix.spec.ts calls each one over HTTP as every role.
export type Who = "anonymous" | "viewer" | "technician" | "engineer" | "manager" | "admin";
export const WHO: Who[] = ["anonymous", "viewer", "technician", "engineer", "manager", "admin"];

export type RouteCase = {
  method: "GET" | "POST" | "PATCH" | "PUT" | "DELETE";
  /** The file under app/ that handles it. */
  file: string;
  path: string | ((ctx: { ovenId: number; unique: string }) => string);
  body?: (ctx: { ovenId: number; unique: string; lineId: number }) => unknown;
  multipart?: "logger-file";
  expect: Record<Who, number>;
};

const all = (ok: number): Record<Who, number> => ({ anonymous: 401, viewer: ok, technician: ok, engineer: ok, manager: ok, admin: ok });
const adminOnly = (ok: number): Record<Who, number> => ({ anonymous: 401, viewer: 403, technician: 403, engineer: 403, manager: 403, admin: ok });
const everyone = (status: number): Record<Who, number> => ({ anonymous: status, viewer: status, technician: status, engineer: status, manager: status, admin: status });
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
];

/** Route files that are not Ovenward's API but the sign-in library's own endpoints. */
export const FRAMEWORK_ROUTES = ["app/api/auth/[...nextauth]/route.ts"];
