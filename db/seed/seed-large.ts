import bcrypt from "bcryptjs";
import type { Client } from "@libsql/client";
import type { Db } from "../client";
import { users } from "../schema/users";
import { lines, ovens, sites } from "../schema/fleet";
import { changes } from "../schema/changes";
import { calibrations, columnMappings, instruments } from "../schema/instruments";
import { processWindows, processWindowVersions, testBoards } from "../schema/windows";
import { recomputeOven } from "../queries/drift";
import { refreshHealth } from "../queries/health";
import { ensureDefaultSubscriptions } from "../queries/subscriptions";
import { findWindowPreset } from "@/lib/thermal/windows";
import { DEMO_USERS } from "./demo-plant";
import { DEMO_BOARDS, DEMO_INSTRUMENTS } from "./demo-story";
import { WINDOWS } from "./seed-runs";
import { LARGE_DAYS, LARGE_OVEN_COUNT, LARGE_WORK_ORDERS, LARGE_PEOPLE, LARGE_SITES, LINES_PER_SITE, LOGGERS_PER_SITE, largeOven, loggerCalibrations, loggerSerial, type LargeOven } from "./large-plant";
import { largeOvenRunStatements, type LargeRunBatch, type LargeRunContext } from "./large-runs";
import { seedLargeMaintenance } from "./large-maintenance";

const DAY = 86_400_000;
const HOUR = 3_600_000;

/**
 * Seeds the large data set into an empty database: 200 ovens on four sites, three years of
 * daily runs, 5 000 changes, 60 000 work orders, then each oven's drift state and health worked
 * out through the app's own rebuild (recomputeOven, refreshHealth). The history ends the day
 * before `end`; everything else is fixed by the seed, so two runs give the same rows.
 */
export type BuildRuns = (index: number, ctx: LargeRunContext) => Promise<LargeRunBatch>;
const inThisThread: BuildRuns = async (index, ctx) => largeOvenRunStatements(largeOven(index), ctx);

export async function seedLarge(
  db: Db,
  { end, password, ovenCount = LARGE_OVEN_COUNT, buildRuns = inThisThread, ahead = 1, log = () => {} }: {
    end: Date;
    password: string;
    ovenCount?: number;
    /** Builds an oven's run statements (the script hands this to worker threads). */
    buildRuns?: BuildRuns;
    /** How many ovens to build ahead of the one being written. */
    ahead?: number;
    log?: (line: string) => void;
  },
) {
  const endDay = Math.floor(end.getTime() / DAY) * DAY;
  const start = endDay - LARGE_DAYS * DAY;
  const now = new Date(endDay + 12 * HOUR);
  const plant = Array.from({ length: ovenCount }, (_, i) => largeOven(i));

  // People (one password hash: bcrypt is slow on purpose), sites, lines, ovens, reference data.
  const hash = await bcrypt.hash(password, 10);
  const people = [...DEMO_USERS.map((u) => ({ ...u, timeZone: LARGE_SITES[0].timeZone })), ...LARGE_PEOPLE];
  const userRows = await db.insert(users).values(people.map((p) => ({ ...p, passwordHash: hash, emailVerified: new Date(start), createdAt: new Date(start), updatedAt: new Date(start) }))).returning();
  const userId = new Map(userRows.map((u) => [u.email, u.id]));
  const engineerOf = (site: number) => userId.get(LARGE_PEOPLE[site * 3 + 2].email) ?? null;
  const ref = await db.transaction(async (tx) => {
    const siteRows = await tx.insert(sites).values(LARGE_SITES.map((s) => ({ name: s.name, timeZone: s.timeZone, createdAt: new Date(start) }))).returning();
    const lineValues = siteRows.flatMap((s) => [
      ...Array.from({ length: LINES_PER_SITE }, (_, i) => ({ siteId: s.id, name: `SMT Line ${i + 1}`, kind: "smt" as const, createdAt: new Date(start) })),
      { siteId: s.id, name: "Prototype lab", kind: "lab" as const, createdAt: new Date(start) },
    ]);
    const lineRows = await tx.insert(lines).values(lineValues).returning();
    const lineId = new Map(lineRows.map((l) => [`${l.siteId}/${l.name}`, l.id]));
    const windowRows: (typeof processWindows.$inferSelect)[] = [];
    for (const w of WINDOWS) {
      const values = { ...findWindowPreset(w.presetId)!.window, ...("overrides" in w ? w.overrides : {}) };
      const [row] = await tx.insert(processWindows).values({ name: w.name, presetId: w.presetId, values, version: 1 }).returning();
      await tx.insert(processWindowVersions).values({ windowId: row.id, version: 1, values });
      windowRows.push(row);
    }
    const boardRows = await tx.insert(testBoards).values(DEMO_BOARDS).returning();
    const boardId = new Map(boardRows.map((b) => [b.name, b.id]));
    const logger = DEMO_INSTRUMENTS[0];
    const loggerRows = await tx
      .insert(instruments)
      .values(LARGE_SITES.flatMap((s, site) => Array.from({ length: LOGGERS_PER_SITE }, (_, k) => ({ ...logger, name: `Logger ${s.code}-${k + 1}`, serial: loggerSerial(site, k), notes: `${s.name.split("— ")[1]} logger` }))))
      .returning();
    const cals = new Map<string, LargeRunContext["calibrations"]>();
    for (const [i, inst] of loggerRows.entries()) {
      const site = Math.floor(i / LOGGERS_PER_SITE);
      const values = loggerCalibrations(site, i % LOGGERS_PER_SITE).map((c) => {
        const performedAt = new Date(start + c.atDay * DAY + 9 * HOUR);
        return { instrumentId: inst.id, performedAt, performedBy: "Kestrel Metrology Ltd", reference: "Fluke 9142 dry-well, reference PRT cert. KM-2231", offsets: c.offsets, expandedUncertainty: 0.25, dueAt: new Date(performedAt.getTime() + c.dueDays * DAY) };
      });
      const rows = await tx.insert(calibrations).values(values).returning();
      cals.set(inst.serial, rows.map((r) => ({ id: r.id, performedAt: r.performedAt.getTime(), dueAt: r.dueAt.getTime(), offsets: r.offsets })));
      const mapping = Object.fromEntries(Array.from({ length: 8 }, (_, c) => [`TC${c + 1}`, `P${c + 1}`]));
      await tx.insert(columnMappings).values(boardRows.map((b) => ({ instrumentId: inst.id, boardId: b.id, mapping })));
    }
    const ovenValues = plant.map((o) => ({
      id: o.index + 1, tag: o.tag, name: o.name, lineId: lineId.get(`${siteRows[o.site].id}/${o.line}`)!, kind: o.kind, zones: o.zones, maker: o.maker, model: o.model,
      serial: o.serial, installedOn: o.installedOn, defaultWindowId: windowRows[0].id, defaultBoardId: boardId.get(o.story.board)!, createdAt: new Date(start), updatedAt: new Date(start),
    }));
    for (let i = 0; i < ovenValues.length; i += 100) await tx.insert(ovens).values(ovenValues.slice(i, i + 100));
    const changeRows = plant.flatMap((o) =>
      o.changes.map((c) => {
        const at = new Date(start + c.day * DAY + 5 * HOUR);
        return { ovenId: o.index + 1, at, area: c.area, summary: c.summary, before: c.before, after: c.after, reason: c.reason, createdBy: engineerOf(o.site), createdAt: at };
      }),
    );
    for (let i = 0; i < changeRows.length; i += 500) await tx.insert(changes).values(changeRows.slice(i, i + 500));
    return { window: windowRows[0], boardId, instrumentId: new Map(loggerRows.map((l) => [l.serial, l.id])), cals, changes: changeRows.length };
  });
  log(`plant, people and ${ref.changes} changes`);

  let runCount = 0;
  let sampleCount = 0;
  const contextOf = (o: LargeOven): LargeRunContext => ({
    ovenId: o.index + 1, start, firstRunId: o.index * LARGE_DAYS + 1, window: { id: ref.window.id, version: ref.window.version, values: ref.window.values },
    boardId: ref.boardId.get(o.story.board)!, instrumentId: ref.instrumentId.get(o.loggerSerial)!, calibrations: ref.cals.get(o.loggerSerial)!,
    createdBy: userId.get(o.story.operatorEmail) ?? null,
  });
  // Bulk load: the run tables' indexes are dropped and made again afterwards (from their own
  // definitions), one sorted build each instead of 200 ovens' worth of scattered inserts.
  const client = (db as unknown as { $client: Client }).$client;
  const indexes = (await client.execute("select name, sql from sqlite_master where type = 'index' and tbl_name in ('run', 'run_channel') and sql is not null")).rows.map((r) => ({ name: String(r.name), sql: String(r.sql) }));
  for (const ix of indexes) await client.execute(`drop index "${ix.name}"`);
  const building = new Map<number, Promise<LargeRunBatch>>();
  for (const o of plant) {
    for (let j = o.index; j <= Math.min(plant.length - 1, o.index + ahead); j++) if (!building.has(j)) building.set(j, buildRuns(j, contextOf(plant[j])));
    const batch = await building.get(o.index)!;
    building.delete(o.index);
    // One transaction per oven; the statements were built off the main thread.
    await client.batch(batch.statements, "write");
    runCount += batch.runs;
    sampleCount += batch.samples;
    if ((o.index + 1) % 20 === 0) log(`runs: ${o.index + 1} of ${plant.length} ovens (${runCount} runs)`);
  }

  for (const ix of indexes) await client.execute(ix.sql);
  log(`runs indexed (${indexes.length} indexes)`);

  const maintenance = await seedLargeMaintenance(
    db,
    plant.map((o: LargeOven) => ({
      id: o.index + 1, tag: o.tag, isLab: o.lineKind === "lab", nitrogen: o.nitrogen, timeZone: LARGE_SITES[o.site].timeZone, breakdownDaysAgo: o.breakdownDaysAgo,
      engineerId: engineerOf(o.site), techId: userId.get(o.story.operatorEmail) ?? null,
    })),
    { now, createdAt: new Date(start), total: Math.round((LARGE_WORK_ORDERS * ovenCount) / LARGE_OVEN_COUNT) },
  );
  log(`maintenance: ${maintenance.plans} plans, ${maintenance.workOrders} work orders (${maintenance.planned} from plans)`);

  let subscriptions = 0;
  for (const u of userRows) subscriptions += await ensureDefaultSubscriptions(db, u, new Date(endDay - 8 * DAY));

  // Drift and health through the app's own rebuild, as after a baseline change.
  for (const o of plant) {
    await db.transaction(async (tx) => {
      await recomputeOven(tx, o.index + 1);
      await refreshHealth(tx, o.index + 1, now);
    });
    if ((o.index + 1) % 40 === 0) log(`drift and health: ${o.index + 1} of ${plant.length} ovens`);
  }
  return { users: userRows.length, sites: LARGE_SITES.length, ovens: plant.length, labOvens: plant.filter((o) => o.lineKind === "lab").length, runs: runCount, samples: sampleCount, changes: ref.changes, ...maintenance, subscriptions, start: new Date(start), now };
}
