import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { createTestDb } from "./test-db";
import type { Role } from "@/db/schema/users";
import { dynamicSegments, urlPathOf } from "../matrix/enumerate";
import { allowedRoles, buildBody, LOGGER_FILE, PNG_FILE, roleTokens, writeRoutes } from "./fuzz/requests";
import { inProcessGet, matrixCtx, seedFor, type Seed } from "./fuzz/seeds";

// Every write route, given the role matrix's valid request with one reference pointing at a record
// that does not exist: a path segment, or a body field ending in "Id". The answer is a 4xx in the
// JSON error shape (404 or 400 naming the field); never a 500 from a foreign-key constraint.
vi.mock("@/lib/auth", () => ({ auth: async () => null }));

const ROOT = path.resolve(__dirname, "../..");
const MISSING = "987654";
type Handler = ((req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>) & { permission?: string | null };
const routes = writeRoutes().filter((r) => !r.file.includes("[...nextauth]"));

let t: Awaited<ReturnType<typeof createTestDb>>;
let uploadDir: string;
const tokens = {} as Record<Role, string>;

beforeAll(async () => {
  t = await createTestDb();
  uploadDir = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-missing-route-refs-"));
  Object.assign(process.env, { DATABASE_URL: t.url, UPLOAD_DIR: uploadDir, API_RATE_LIMIT_PER_MINUTE: "0", CRON_SECRET: "missing-refs-cron-secret-0123" });
  Object.assign(tokens, await roleTokens(t.db, "missing"));
});
afterAll(() => {
  t?.close();
  fs.rmSync(uploadDir, { recursive: true, force: true });
});

function request(file: string, method: string, seed: Seed, params: Record<string, string>, json: unknown, role: Role) {
  let url = urlPathOf(file);
  for (const s of dynamicSegments(file)) url = url.replace(new RegExp(`\\[(\\.\\.\\.)?${s}\\]`), encodeURIComponent(params[s]));
  const body = seed.multipart
    ? buildBody({ kind: "multipart", parts: [{ name: "file", fileName: seed.multipart === "png" ? "photo.png" : "run.csv", bytes: seed.multipart === "png" ? PNG_FILE : LOGGER_FILE, type: seed.multipart === "png" ? "image/png" : "text/csv" }] })
    : json === undefined ? buildBody({ kind: "empty" }) : buildBody({ kind: "json", text: JSON.stringify(json) });
  return new Request(`http://localhost${url}${seed.query ? `?${seed.query}` : ""}`, { method, headers: { ...body.headers, authorization: `Bearer ${tokens[role]}` }, body: body.body });
}

describe("a reference to a record that does not exist, sent to a write route", () => {
  it("is answered with a 4xx in the JSON error shape by every route that takes one", async () => {
    const errors = vi.spyOn(console, "error").mockImplementation(() => {});
    const wrong: string[] = [];
    let tried = 0;
    for (const { file, method } of routes) {
      const handler = ((await import(path.join(ROOT, file))) as Record<string, Handler>)[method];
      const allowed = allowedRoles(handler.permission);
      const role = allowed.includes("admin") ? "admin" : allowed[0];
      // A fresh valid request per case: a previous case may have used up the record it names.
      const make = async () => seedFor(file, method, await matrixCtx(t.db, role, inProcessGet(tokens.viewer)));
      const first = await make();
      if (!first) continue;
      const references = [
        ...Object.keys(first.params).map((k) => ({ where: "path", key: k })),
        ...(first.json && typeof first.json === "object" && !Array.isArray(first.json) ? Object.keys(first.json).filter((k) => /Id$/.test(k)).map((k) => ({ where: "body", key: k })) : []),
      ];
      for (const ref of references) {
        const seed = (await make())!;
        const params = ref.where === "path" ? { ...seed.params, [ref.key]: MISSING } : seed.params;
        const json = ref.where === "body" ? { ...(seed.json as object), [ref.key]: Number(MISSING) } : seed.json;
        const res = await handler(request(file, method, seed, params, json, role), { params: Promise.resolve(params) });
        tried++;
        const body = res.status >= 400 ? await res.json().catch(() => null) : null;
        if (res.status < 400 || res.status >= 500 || !body?.error?.code) wrong.push(`${method} ${urlPathOf(file)} ${ref.where} ${ref.key}: ${res.status} ${JSON.stringify(body)?.slice(0, 200)}`);
      }
    }
    errors.mockRestore();
    expect(tried).toBeGreaterThanOrEqual(20);
    expect(wrong).toEqual([]);
  });
});
