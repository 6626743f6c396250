import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { FRAMEWORK_ROUTES, ROUTE_MATRIX } from "../../matrix/routes";
import { actionProblems, inlineServerActions, isRouteFile, isServerActionFile, isSource, routeProblems, staleMatrixRows, walk, type RoutePolicy } from "../../matrix/enumerate";

// Fails when a route handler or a server action exists that the role matrix does not cover.
// The parsing and the checks live in tests/matrix/enumerate.ts; enumerate.test.ts proves they
// fail on synthetic files.
const ROOT = path.resolve(__dirname, "../../..");
const read = (f: string) => (fs.existsSync(path.join(ROOT, f)) ? fs.readFileSync(path.join(ROOT, f), "utf8") : null);

const ROUTE_POLICY: RoutePolicy = {
  matrix: ROUTE_MATRIX,
  framework: FRAMEWORK_ROUTES,
  // No user behind these: cron routes check the scheduler's shared secret (lib/cron.ts), the
  // one-click unsubscribe its signed token.
  secretChecked: [
    { match: (f) => f.startsWith("app/api/cron/"), wrapper: "withCronSecret" },
    { match: (f) => f === "app/api/unsubscribe/route.ts", wrapper: "withSignedToken" },
  ],
  publicFunctions: ["GET app/api/health/route.ts"],
};

// Server actions that exist to establish who the user is; everything else must use invokeAction.
const PUBLIC_ACTIONS = new Set([
  "app/(auth)/sign-in/actions.ts#passwordSignInAction",
  "app/(auth)/sign-in/actions.ts#magicLinkAction",
  "app/(auth)/invite/[token]/actions.ts#acceptInviteAction",
  "components/shell/actions.ts#signOutAction",
]);

const sourceFiles = ["app", "components", "lib"].flatMap((d) => walk(ROOT, path.join(ROOT, d))).filter(isSource);
const routeFiles = sourceFiles.filter((f) => f.startsWith("app/") && isRouteFile(f));

describe("route handlers", () => {
  it("finds the route files, including those outside app/api", () => {
    expect(routeFiles.length).toBeGreaterThan(30);
    expect(routeFiles).toContain("app/(app)/dev/mail/preview/[template]/route.ts");
  });
  for (const file of routeFiles) {
    it(`${file}: every exported method is in the role matrix and goes through its wrapper`, () => {
      expect(routeProblems(file, read(file)!, ROUTE_POLICY)).toEqual([]);
    });
  }
  it("the matrix names no route or method that is gone", () => {
    expect(staleMatrixRows(ROUTE_MATRIX, read)).toEqual([]);
  });
});

describe("server actions", () => {
  const actionFiles = sourceFiles.filter((f) => isServerActionFile(f, read(f)!));
  it("there are some to check", () => expect(actionFiles.length).toBeGreaterThan(2));
  for (const file of actionFiles) {
    it(`${file}: every exported action authenticates and checks a permission`, () => {
      expect(actionProblems(file, read(file)!, PUBLIC_ACTIONS)).toEqual([]);
    });
  }
  it("no inline \"use server\" functions (they would escape this scan)", () => {
    expect(sourceFiles.flatMap((f) => inlineServerActions(f, read(f)!))).toEqual([]);
  });
});
