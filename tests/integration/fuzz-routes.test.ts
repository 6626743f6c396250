import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { createTestDb } from "./test-db";
import type { Role } from "@/db/schema/users";
import { dynamicSegments, urlPathOf } from "../matrix/enumerate";
import { hostileString, schemaVocabulary } from "./fuzz/arbitraries";
import { allowedRoles, authArb, buildBody, expectClientAnswer, hostileId, mutatedBody, randomBody, roleTokens, writeRoutes } from "./fuzz/requests";
import { inProcessGet, matrixCtx, seedFor } from "./fuzz/seeds";

// Every write handler under app/ (found by parsing the files, so a new one is fuzzed without
// being listed) is called with random requests against a real database: half mutations of the
// role matrix's valid request, half anything at all. Each answer must be a 2xx or a 4xx in the
// JSON error shape: never a 500, never a thrown error. FUZZ_RUNS raises the count per handler.
vi.mock("@/lib/auth", () => ({ auth: async () => null })); // bearer tokens only; no cookie path here

const RUNS = Number(process.env.FUZZ_RUNS ?? 40);
const ROOT = path.resolve(__dirname, "../..");
/** Write routes this file does not call, each with the reason. */
const NOT_FUZZED: Record<string, string> = {
  "app/api/auth/[...nextauth]/route.ts": "the sign-in library's own endpoints; sign-in limits are tested through them in tests/integration/auth-endpoints.test.ts",
};

type Handler = ((req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>) & { permission?: string | null };
const routes = writeRoutes();

let t: Awaited<ReturnType<typeof createTestDb>>;
let uploadDir: string;
const tokens = {} as Record<Role, string>;
let vocab: Awaited<ReturnType<typeof schemaVocabulary>>;
const prototypeBefore = Object.getOwnPropertyNames(Object.prototype).sort();
const statuses: Record<string, number> = {};
const seeds = new Map<string, { handler: Handler; seed: Awaited<ReturnType<typeof seedFor>> }>();

beforeAll(async () => {
  t = await createTestDb();
  uploadDir = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-fuzz-uploads-"));
  Object.assign(process.env, { DATABASE_URL: t.url, UPLOAD_DIR: uploadDir, API_RATE_LIMIT_PER_MINUTE: "0", CRON_SECRET: "fuzz-cron-secret-0123456789" });
  Object.assign(tokens, await roleTokens(t.db, "fuzz"));
  vocab = await schemaVocabulary();
  // Every seed is made before any fuzzing: a fuzzed edit may rename the oven they look up.
  for (const { file, method } of routes) {
    if (NOT_FUZZED[file]) continue;
    const handler = ((await import(path.join(ROOT, file))) as Record<string, Handler>)[method];
    const who = allowedRoles(handler.permission).find((r) => r !== "admin") ?? "admin";
    seeds.set(`${method} ${file}`, { handler, seed: await seedFor(file, method, await matrixCtx(t.db, who, inProcessGet(tokens.viewer))) });
  }
});
afterAll(() => {
  t?.close();
  fs.rmSync(uploadDir, { recursive: true, force: true });
  if (process.env.FUZZ_STATS) console.log(Object.entries(statuses).sort().map(([k, v]) => `${v}\t${k}`).join("\n"));
});

describe("fuzzed write routes answer 2xx or 4xx, never 500", () => {
  it("finds the write routes", () => {
    expect(routes.length).toBeGreaterThan(20);
    expect(routes.map((r) => `${r.method} ${r.file}`)).toContain("POST app/api/v1/ovens/[ovenId]/runs/route.ts");
  });

  for (const { file, method } of routes) {
    if (NOT_FUZZED[file]) continue;
    it(`${method} ${urlPathOf(file)}`, async () => {
      const { handler, seed } = seeds.get(`${method} ${file}`)!;
      const segments = dynamicSegments(file);
      const randomQuery = fc.array(fc.tuple(fc.oneof(fc.constantFrom(...vocab.keys, "token"), fc.string({ maxLength: 10 })), hostileString), { maxLength: 4 }).map((q) => new URLSearchParams(q).toString());
      const random = fc.record({ ids: fc.array(hostileId, { minLength: segments.length, maxLength: segments.length }), query: randomQuery, body: randomBody(vocab) });
      const mutated = seed
        ? fc.record({
            ids: fc.tuple(...segments.map((s) => fc.oneof({ weight: 4, arbitrary: fc.constant(seed.params[s]) }, { weight: 1, arbitrary: hostileId })), fc.constant("")).map((xs) => xs.slice(0, segments.length)),
            query: fc.oneof(fc.constant(seed.query), randomQuery),
            body: mutatedBody(seed, vocab),
          })
        : random;
      const requestArb = fc.record({ shape: fc.oneof(random, mutated), auth: authArb(handler.permission, tokens) });

      await fc.assert(
        fc.asyncProperty(requestArb, async ({ shape: { ids, query, body }, auth }) => {
          const params = Object.fromEntries(segments.map((s, i) => [s, ids[i]]));
          let url = urlPathOf(file);
          for (const s of segments) url = url.replace(new RegExp(`\\[(\\.\\.\\.)?${s}\\]`), encodeURIComponent(params[s]));
          const { body: payload, headers } = buildBody(body);
          const req = new Request(`http://localhost${url}${query ? `?${query}` : ""}`, { method, headers: { ...headers, ...(auth ? { authorization: auth } : {}) }, body: payload });
          const res = await handler(req, { params: Promise.resolve(params) });
          const key = `${method} ${file} ${res.status}`;
          statuses[key] = (statuses[key] ?? 0) + 1;
          await expectClientAnswer(res, `${method} ${url}?${query} (${body.kind})`);
        }),
        { numRuns: RUNS },
      );
    }, 30_000 + RUNS * 400);
  }

  it("no request polluted Object.prototype", () => {
    expect(Object.getOwnPropertyNames(Object.prototype).sort()).toEqual(prototypeBefore);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });
});
