import bcrypt from "bcryptjs";
import { and, eq } from "drizzle-orm";
import type { Db } from "../client";
import { lines, ovens, sites } from "../schema/fleet";
import { users } from "../schema/users";
import { seedMaintenance } from "./seed-maintenance";
import { DEMO_LINES, DEMO_OVENS, DEMO_SITE, DEMO_USERS } from "./demo-plant";
import { seedMail } from "./seed-mail";
import { seedRuns } from "./seed-runs";
import { seedChangesAndDrift } from "./seed-drift";

/**
 * Seeds the demo plant. Idempotent: every row is looked up by its natural key first and left
 * alone when present, so a second run changes nothing.
 */
export async function seedDemo(db: Db, { password, now = new Date() }: { password: string; now?: Date }) {
  const counts = { users: 0, sites: 0, lines: 0, ovens: 0, subscriptions: 0, runs: 0, changes: 0 };
  await db.transaction(async (tx) => {
    for (const u of DEMO_USERS) {
      const [found] = await tx.select({ id: users.id }).from(users).where(eq(users.email, u.email)).limit(1);
      if (found) continue;
      await tx.insert(users).values({ ...u, passwordHash: await bcrypt.hash(password, 10), emailVerified: new Date() });
      counts.users++;
    }
    let [site] = await tx.select().from(sites).where(eq(sites.name, DEMO_SITE.name)).limit(1);
    if (!site) {
      [site] = await tx.insert(sites).values(DEMO_SITE).returning();
      counts.sites++;
    }
    const lineIds = new Map<string, number>();
    for (const l of DEMO_LINES) {
      let [line] = await tx.select().from(lines).where(and(eq(lines.siteId, site.id), eq(lines.name, l.name))).limit(1);
      if (!line) {
        [line] = await tx.insert(lines).values({ ...l, siteId: site.id }).returning();
        counts.lines++;
      }
      lineIds.set(l.name, line.id);
    }
    for (const o of DEMO_OVENS) {
      const [found] = await tx.select({ id: ovens.id }).from(ovens).where(eq(ovens.tag, o.tag)).limit(1);
      if (found) continue;
      const { line, ...rest } = o;
      await tx.insert(ovens).values({ ...rest, lineId: lineIds.get(line)! });
      counts.ovens++;
    }
  });
  counts.subscriptions = (await seedMail(db, { now })).subscriptions;
  counts.runs = (await seedRuns(db, { now })).runs;
  // Plans, eighteen months of work orders and meter readings (idempotent on its own keys).
  await seedMaintenance(db, { now });
  // The modification log, then drift state and health from the whole history (needs runs and orders).
  counts.changes = (await seedChangesAndDrift(db, { now })).changes;
  return counts;
}
