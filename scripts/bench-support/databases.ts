import fs from "node:fs";
import path from "node:path";
import { and, desc, eq, inArray, isNull, sql } from "drizzle-orm";
import { openDatabase } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { seedDemo } from "@/db/seed/seed-demo";
import { createApiToken } from "@/db/queries/api-tokens";
import { lines, ovens } from "@/db/schema/fleet";
import { runs } from "@/db/schema/runs";
import { users } from "@/db/schema/users";
import { workOrders } from "@/db/schema/maintenance";

/** A fresh demo database in `dir` (the seed's own data, as `npm run demo` makes it). */
export async function freshDemo(dir: string): Promise<string> {
  const url = `file:${path.join(dir, "demo.db")}`;
  const { db, client } = await openDatabase(url);
  await migrateDatabase(db);
  await seedDemo(db, { password: "ovenward-demo" });
  await client.execute("PRAGMA wal_checkpoint(TRUNCATE)");
  client.close();
  return url;
}

/** A copy of the large database, so the benchmark's writes leave the seeded one as it was. */
export function copyOf(sourceUrl: string, dir: string): string {
  const source = sourceUrl.replace(/^file:/, "");
  const target = path.join(dir, "large.db");
  for (const suffix of ["", "-wal"]) if (fs.existsSync(source + suffix)) fs.copyFileSync(source + suffix, target + suffix);
  return `file:${target}`;
}

export type Fixtures = { token: string; siteId: number; siteOvens: number; trendOvenId: number; uploadOvenId: number; instrumentId: number | null; openWorkOrders: number[]; ovens: number; runs: number; workOrders: number };

/**
 * What the requests need: an engineer's API token (made with the app's own token code), the oven
 * with the longest history (its trend), a line oven to upload to with its logger, open orders.
 */
export async function fixtures(url: string): Promise<Fixtures> {
  const { db, client } = await openDatabase(url);
  await migrateDatabase(db);
  try {
    const [engineer] = await db.select().from(users).where(eq(users.email, "engineer@brightwater.example"));
    if (!engineer) throw new Error(`${url} has no engineer@brightwater.example: seed it with the demo or the large seed.`);
    const { secret } = await createApiToken(db, { userId: engineer.id, name: `bench ${new Date().toISOString()}` }, null);
    const counts = await db.select({ ovenId: runs.ovenId, n: sql<number>`count(*)` }).from(runs).where(isNull(runs.deletedAt)).groupBy(runs.ovenId).orderBy(desc(sql`count(*)`), runs.ovenId);
    const line = await db.select({ id: ovens.id }).from(ovens).where(eq(ovens.kind, "convection")).orderBy(ovens.id);
    const uploadOvenId = line.find((o) => counts.some((c) => c.ovenId === o.id))?.id ?? line[0].id;
    const [last] = await db.select({ instrumentId: runs.instrumentId }).from(runs).where(eq(runs.ovenId, uploadOvenId)).orderBy(desc(runs.runAt)).limit(1);
    const open = await db.select({ id: workOrders.id }).from(workOrders).where(and(inArray(workOrders.state, ["open", "in_progress"]), eq(workOrders.breakdown, false))).orderBy(workOrders.id).limit(5000);
    const [{ n: woTotal }] = await db.select({ n: sql<number>`count(*)` }).from(workOrders);
    const [site] = await db.select({ siteId: lines.siteId, n: sql<number>`count(*)` }).from(ovens).innerJoin(lines, eq(lines.id, ovens.lineId)).groupBy(lines.siteId).orderBy(lines.siteId).limit(1);
    return {
      token: secret, siteId: site.siteId, siteOvens: Number(site.n), trendOvenId: counts[0].ovenId, uploadOvenId, instrumentId: last?.instrumentId ?? null, openWorkOrders: open.map((o) => o.id),
      ovens: (await db.select({ id: ovens.id }).from(ovens)).length, runs: counts.reduce((s, c) => s + Number(c.n), 0), workOrders: Number(woTotal),
    };
  } finally {
    client.close();
  }
}
