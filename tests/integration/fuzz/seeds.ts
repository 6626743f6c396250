import fs from "node:fs";
import path from "node:path";
import fc from "fast-check";
import { and, asc, desc, eq, isNull } from "drizzle-orm";
import type { Db } from "@/db/client";
import { ovens } from "@/db/schema/fleet";
import { runs } from "@/db/schema/runs";
import { processWindows, testBoards } from "@/db/schema/windows";
import { instruments } from "@/db/schema/instruments";
import { maintenancePlans, workOrders } from "@/db/schema/maintenance";
import { ROUTE_MATRIX, type MatrixCtx, type RouteCase, type Who } from "../../matrix/routes";
import { dynamicSegments, isRouteFile, moduleExports, urlPathOf, walk } from "../../matrix/enumerate";
import { RawObject } from "./arbitraries";

/*
 * Valid requests to start from: the role matrix's own bodies (tests/matrix/routes.ts), filled
 * in with records of the seeded demo. Mutating a valid body reaches the code behind validation,
 * which purely random objects almost never do.
 */

const ROOT = path.resolve(__dirname, "../../..");
type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** GET through the route handlers themselves (for bodies that need a record's current version). */
export function inProcessGet(token: string) {
  const getRoutes = walk(ROOT, path.join(ROOT, "app"))
    .filter((f) => isRouteFile(f) && moduleExports(f, fs.readFileSync(path.join(ROOT, f), "utf8")).names.has("GET"))
    .map((file) => ({ file, segments: dynamicSegments(file), re: new RegExp(`^${urlPathOf(file).replace(/\[(\.\.\.)?\w+\]/g, "([^/]+)")}$`) }));
  return async (url: string): Promise<Record<string, unknown>> => {
    const pathname = new URL(url, "http://localhost").pathname;
    const route = getRoutes.find((r) => r.re.test(pathname));
    if (!route) throw new Error(`no GET route for ${url}`);
    const values = route.re.exec(pathname)!.slice(1).map(decodeURIComponent);
    const mod = (await import(path.join(ROOT, route.file))) as { GET: Handler };
    const res = await mod.GET(new Request(`http://localhost${url}`, { headers: { authorization: `Bearer ${token}` } }), { params: Promise.resolve(Object.fromEntries(route.segments.map((s, i) => [s, values[i]]))) });
    return res.json();
  };
}

export async function matrixCtx(db: Db, who: Who, get: MatrixCtx["get"]): Promise<MatrixCtx> {
  const [oven] = await db.select().from(ovens).where(eq(ovens.tag, "LAB-B2"));
  const ovenRuns = await db.select({ id: runs.id }).from(runs).where(and(eq(runs.ovenId, oven.id), isNull(runs.deletedAt))).orderBy(desc(runs.runAt));
  const first = async (table: typeof processWindows | typeof testBoards | typeof instruments) => (await db.select({ id: table.id }).from(table).orderBy(asc(table.id)).limit(1))[0]?.id ?? 1;
  const [wo] = await db.select({ id: workOrders.id }).from(workOrders).where(and(eq(workOrders.ovenId, oven.id), eq(workOrders.state, "open"))).limit(1);
  const [plan] = await db.select({ id: maintenancePlans.id }).from(maintenancePlans).where(eq(maintenancePlans.ovenId, oven.id)).limit(1);
  return {
    ovenId: oven.id,
    lineId: oven.lineId,
    unique: Math.random().toString(36).slice(2, 8).toUpperCase(),
    who,
    ids: {
      runId: ovenRuns[0]?.id ?? 1,
      deletableRunIds: Array.from({ length: 6 }, (_, i) => ovenRuns[10 + i]?.id ?? 1),
      windowId: await first(processWindows),
      boardId: await first(testBoards),
      instrumentId: await first(instruments),
      certificateCalibrationId: 1,
    },
    workOrderId: wo?.id ?? 1,
    attachmentId: 1,
    planId: plan?.id ?? 1,
    get,
  };
}

export type Seed = { params: Record<string, string>; query: string; json?: unknown; multipart?: RouteCase["multipart"] };

/** The matrix's valid request for a route and method, if it has one, with its path ids. */
export async function seedFor(file: string, method: string, ctx: MatrixCtx): Promise<Seed | null> {
  const row = ROUTE_MATRIX.find((r) => r.file === file && r.method === method);
  if (!row) return null;
  const url = new URL(typeof row.path === "string" ? row.path : row.path(ctx), "http://localhost");
  const segments = dynamicSegments(file);
  const re = new RegExp(`^${urlPathOf(file).replace(/\[(\.\.\.)?\w+\]/g, "([^/]+)")}$`);
  const values = re.exec(url.pathname)?.slice(1) ?? [];
  return {
    params: Object.fromEntries(segments.map((s, i) => [s, decodeURIComponent(values[i] ?? "1")])),
    query: url.search.slice(1),
    json: row.body ? await row.body(ctx) : undefined,
    multipart: row.multipart,
  };
}

/** A valid value with some parts kept, some replaced by hostile values, some dropped, some added. */
export function mutate(valid: unknown, hostile: fc.Arbitrary<unknown>, key: fc.Arbitrary<string>, depth = 0): fc.Arbitrary<unknown> {
  // Mostly kept, so that a request usually has one or two bad parts and the rest passes.
  const replace = { weight: 1, arbitrary: hostile };
  if (Array.isArray(valid)) {
    const items = fc.tuple(...valid.map((v) => mutate(v, hostile, key, depth + 1)));
    return fc.oneof({ weight: 10, arbitrary: items }, replace, { weight: 1, arbitrary: fc.array(hostile, { maxLength: 4 }) }, { weight: 1, arbitrary: items.map((xs) => [...xs, ...xs, ...xs]) });
  }
  if (valid && typeof valid === "object") {
    const entries = Object.entries(valid as Record<string, unknown>).map(([k, v]) =>
      fc.oneof({ weight: 12, arbitrary: mutate(v, hostile, key, depth + 1).map((m) => [[k, m]] as [string, unknown][]) }, { weight: 1, arbitrary: fc.constant([] as [string, unknown][]) }),
    );
    const extra = fc.oneof({ weight: 3, arbitrary: fc.constant([] as [string, unknown][]) }, { weight: 1, arbitrary: fc.array(fc.tuple(key, hostile), { minLength: 1, maxLength: depth === 0 ? 3 : 1 }) });
    const obj = fc.tuple(fc.tuple(...entries), extra).map(([kept, added]) => new RawObject([...kept.flat(), ...added]));
    return fc.oneof({ weight: 12, arbitrary: obj }, replace);
  }
  return fc.oneof({ weight: 12, arbitrary: fc.constant(valid) }, replace);
}
