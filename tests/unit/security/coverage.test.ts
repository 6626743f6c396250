import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { FRAMEWORK_ROUTES, ROUTE_MATRIX } from "../../matrix/routes";

// Fails when a route handler or a server action exists that the role matrix does not cover.
const ROOT = path.resolve(__dirname, "../../..");

function walk(dir: string, out: string[] = []): string[] {
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, entry.name);
    if (entry.isDirectory()) walk(p, out);
    else out.push(path.relative(ROOT, p));
  }
  return out;
}

/**
 * Routes with no user behind them check something else instead of a role: cron routes the
 * scheduler's shared secret (lib/cron.ts), the one-click unsubscribe its signed token.
 */
const SECRET_CHECKED: { match: (file: string) => boolean; wrapper: RegExp }[] = [
  { match: (f) => f.startsWith("app/api/cron/"), wrapper: /export const POST\s*=\s*withCronSecret\(/ },
  { match: (f) => f === "app/api/unsubscribe/route.ts", wrapper: /export const POST\s*=\s*withSignedToken\(/ },
];

const appFiles = walk(path.join(ROOT, "app"));
const sourceFiles = [...appFiles, ...walk(path.join(ROOT, "components"))].filter((f) => /\.(ts|tsx)$/.test(f));

describe("route handlers", () => {
  const routeFiles = appFiles.filter((f) => /route\.ts$/.test(f));
  for (const file of routeFiles) {
    const text = fs.readFileSync(path.join(ROOT, file), "utf8");
    const methods = [...text.matchAll(/export const (GET|POST|PATCH|PUT|DELETE)\b/g)].map((m) => m[1]);
    const fnMethods = [...text.matchAll(/export async function (GET|POST|PATCH|PUT|DELETE)\b/g)].map((m) => m[1]);
    it(`${file} is in the role matrix`, () => {
      if (FRAMEWORK_ROUTES.includes(file)) return expect(text).toContain("handlers");
      expect(methods.length + fnMethods.length).toBeGreaterThan(0);
      for (const m of [...methods, ...fnMethods]) {
        expect(ROUTE_MATRIX.some((r) => r.file === file && r.method === m), `${m} ${file} missing from tests/matrix/routes.ts`).toBe(true);
      }
    });
    it(`${file} goes through withApi (or is the public health check)`, () => {
      if (FRAMEWORK_ROUTES.includes(file)) return expect(text).toMatch(/export const \{ GET, POST \} = handlers/);
      if (file === "app/api/health/route.ts") return expect(fnMethods).toEqual(["GET"]);
      const secret = SECRET_CHECKED.find((r) => r.match(file));
      if (secret) {
        expect(text).toMatch(secret.wrapper);
        return expect(fnMethods).toEqual([]);
      }
      for (const m of methods) expect(text).toMatch(new RegExp(`export const ${m}\\s*=\\s*withApi`));
      expect(fnMethods).toEqual([]);
    });
  }
});

// Server actions that exist to establish who the user is; everything else must use invokeAction.
const PUBLIC_ACTIONS = new Set([
  "app/(auth)/sign-in/actions.ts#passwordSignInAction",
  "app/(auth)/sign-in/actions.ts#magicLinkAction",
  "app/(auth)/invite/[token]/actions.ts#acceptInviteAction",
  "components/shell/actions.ts#signOutAction",
]);

describe("server actions", () => {
  const actionFiles = sourceFiles.filter((f) => /^\s*["']use server["']/.test(fs.readFileSync(path.join(ROOT, f), "utf8")));
  it("there are some to check", () => expect(actionFiles.length).toBeGreaterThan(2));
  for (const file of actionFiles) {
    const text = fs.readFileSync(path.join(ROOT, file), "utf8");
    const blocks = text.split(/(?=export async function )/).filter((b) => b.startsWith("export async function"));
    for (const block of blocks) {
      const name = /export async function (\w+)/.exec(block)![1];
      it(`${file}#${name} authenticates and checks a permission`, () => {
        // Public actions still validate what they are sent (or take nothing, like sign-out).
        if (PUBLIC_ACTIONS.has(`${file}#${name}`)) return expect(block).toMatch(/safeParse\(|signOut\(/);
        expect(block, `${name} must call invokeAction(def, …) so the wrapper checks the role`).toMatch(/invokeAction\(\w+Def,/);
      });
    }
  }
});
