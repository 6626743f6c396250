import { describe, expect, it } from "vitest";
import { actionProblems, dynamicSegments, inlineServerActions, isRouteFile, isServerActionFile, moduleExports, routeProblems, staleMatrixRows, urlPathOf, type RoutePolicy } from "../../matrix/enumerate";

// The enumerator behind coverage.test.ts, fed synthetic files: each way of adding a route,
// a method or an action without listing it must produce a problem.
const F = "app/api/v1/widgets/[widgetId]/route.ts";
const policy = (matrix: { method: string; file: string }[]): RoutePolicy => ({
  matrix,
  framework: ["app/api/auth/[...nextauth]/route.ts"],
  secretChecked: [{ match: (f) => f.startsWith("app/api/cron/"), wrapper: "withCronSecret" }],
  publicFunctions: ["GET app/api/health/route.ts"],
});

describe("route enumeration", () => {
  it("sees every way of exporting a method", () => {
    const text = `
      import { withApi } from "@/lib/api";
      export const GET = withApi(async () => ({}), { permission: "oven.read" });
      export async function PUT(req: Request) { return new Response(); }
      export function OPTIONS() { return new Response(); }
      const h = withApi(async () => ({}), { permission: "oven.update" });
      export { h as DELETE };
      export const { HEAD } = { HEAD: h };
      export const PATCH = (withApi(async () => ({}), { permission: "oven.update" })) as unknown;`;
    expect([...moduleExports(F, text).names.keys()].sort()).toEqual(["DELETE", "GET", "HEAD", "OPTIONS", "PATCH", "PUT"]);
  });

  it("a listed, wrapped method passes", () => {
    expect(routeProblems(F, `export const GET = withApi(async () => 1, { permission: "oven.read" });`, policy([{ method: "GET", file: F }]))).toEqual([]);
  });

  it("fails for a method missing from the matrix, even if wrapped", () => {
    const text = `export const GET = withApi(a, b);\nexport const DELETE = withApi(a, b);`;
    expect(routeProblems(F, text, policy([{ method: "GET", file: F }]))).toEqual([`DELETE ${F} missing from tests/matrix/routes.ts`]);
  });

  it("fails for an unwrapped handler, a re-export, and export *", () => {
    const m = ["GET", "PUT", "PATCH"].map((method) => ({ method, file: F }));
    const text = `export async function PUT() {}\nexport { x as PATCH } from "./x";\nexport const GET = withApi(a, b);\nexport * from "./more";`;
    const problems = routeProblems(F, text, policy(m));
    expect(problems).toHaveLength(3);
    expect(problems.join("\n")).toMatch(/export \*/);
    expect(problems.join("\n")).toMatch(/PUT .*found function/);
    expect(problems.join("\n")).toMatch(/PATCH .*found reexport/);
  });

  it("a cron route must use the secret wrapper, not withApi", () => {
    const cron = "app/api/cron/tick/route.ts";
    expect(routeProblems(cron, `export const POST = withApi(a, b);`, policy([{ method: "POST", file: cron }]))).toHaveLength(1);
    expect(routeProblems(cron, `export const POST = withCronSecret(a);`, policy([{ method: "POST", file: cron }]))).toEqual([]);
  });

  it("finds route files of every extension and maps them to URLs", () => {
    expect(["app/a/route.ts", "app/(app)/b/route.tsx", "app/c/route.js", "app/d/router.ts", "app/e/page.tsx"].filter(isRouteFile)).toEqual(["app/a/route.ts", "app/(app)/b/route.tsx", "app/c/route.js"]);
    expect(urlPathOf("app/(app)/dev/mail/preview/[template]/route.ts")).toBe("/dev/mail/preview/[template]");
    expect(dynamicSegments("app/api/v1/ovens/[ovenId]/runs/[runId]/route.ts")).toEqual(["ovenId", "runId"]);
  });

  it("flags matrix rows whose method is gone", () => {
    const files: Record<string, string> = { [F]: `export const GET = withApi(a, b);` };
    const rows = [{ method: "GET", file: F }, { method: "POST", file: F }, { method: "GET", file: "app/gone/route.ts" }];
    expect(staleMatrixRows(rows, (f) => files[f] ?? null)).toHaveLength(2);
  });
});

describe("server action enumeration", () => {
  const A = "app/(app)/widgets/actions.ts";
  const pub = new Set<string>();

  it("sees a \"use server\" directive after a comment, and not one inside a comment", () => {
    expect(isServerActionFile(A, `// widgets\n/* forms */\n"use server";\nexport async function a() {}`)).toBe(true);
    expect(isServerActionFile(A, `// What a "use server" function calls\nexport function f() {}`)).toBe(false);
    expect(isServerActionFile(A, `import x from "y";\n"use server";`)).toBe(false);
  });

  it("passes an action that calls invokeAction with a definition from lib/actions", () => {
    const text = `"use server";\nimport { fooDef } from "@/lib/actions/widgets";\nexport async function fooAction(p: unknown, f: FormData) { return invokeAction(fooDef, f); }`;
    expect(actionProblems(A, text, pub)).toEqual([]);
  });

  it("fails for an arrow-function action, a plain function, a re-export or a local definition that skip the wrapper", () => {
    const text = `"use server";
      import { fooDef } from "@/lib/actions/widgets";
      const localDef = defineAction({});
      export const arrowAction = async (p: unknown, f: FormData) => doIt(f);
      export function plainAction(f: FormData) { return db.delete(f); }
      export { other as otherAction } from "./other";
      export async function localAction(p: unknown, f: FormData) { return invokeAction(localDef, f); }
      export async function okAction(p: unknown, f: FormData) { return invokeAction(fooDef, f); }`;
    const problems = actionProblems(A, text, pub);
    expect(problems.map((p) => p.split(":")[0]).sort()).toEqual([`${A}#arrowAction`, `${A}#localAction`, `${A}#otherAction`, `${A}#plainAction`]);
  });

  it("finds inline \"use server\" functions", () => {
    const page = `export default function Page() {\n  async function save(f: FormData) {\n    "use server";\n    await db.insert(f);\n  }\n  return null;\n}`;
    expect(inlineServerActions("app/(app)/x/page.tsx", page)).toEqual(["app/(app)/x/page.tsx:2"]);
    expect(inlineServerActions("lib/action-invoke.ts", `/** What a "use server" function calls */\nexport async function f() { return 1; }`)).toEqual([]);
  });
});
