import { and, eq } from "drizzle-orm";
import type { Db } from "../client";
import { ovens } from "../schema/fleet";
import { users } from "../schema/users";
import { changes } from "../schema/changes";
import { driftStates, ovenHealth } from "../schema/drift";
import { workOrders } from "../schema/maintenance";
import { alerts } from "../schema/drift";
import { recomputeOven } from "../queries/drift";
import { refreshHealth } from "../queries/health";
import { DEMO_CHANGES } from "./demo-story";

const DAY = 86_400_000;

/**
 * The demo's modification log (the story's changes, on the dates the runs model uses), then each
 * oven's drift state and health worked out from its whole history. Idempotent: changes are looked
 * up by oven and time; drift and health are only computed for ovens that have none yet.
 */
export async function seedChangesAndDrift(db: Db, { now }: { now: Date }) {
  const end = Math.floor(now.getTime() / DAY) * DAY;
  const [engineer] = await db.select({ id: users.id }).from(users).where(eq(users.email, "engineer@brightwater.example"));
  let created = 0;
  await db.transaction(async (tx) => {
    for (const c of DEMO_CHANGES) {
      const [oven] = await tx.select({ id: ovens.id }).from(ovens).where(eq(ovens.tag, c.ovenTag));
      if (!oven) continue;
      const at = new Date(end - c.daysBeforeEnd * DAY + 5 * 3_600_000);
      const [found] = await tx.select({ id: changes.id }).from(changes).where(and(eq(changes.ovenId, oven.id), eq(changes.at, at)));
      if (found) continue;
      await tx.insert(changes).values({ ovenId: oven.id, at, area: c.area, summary: c.summary, before: c.before, after: c.after, reason: c.why, createdBy: engineer?.id ?? null, createdAt: at });
      created++;
    }
  });
  const all = await db.select({ id: ovens.id, tag: ovens.tag }).from(ovens);
  for (const o of all) {
    const [state] = await db.select({ ovenId: driftStates.ovenId }).from(driftStates).where(eq(driftStates.ovenId, o.id)).limit(1);
    const [health] = await db.select({ ovenId: ovenHealth.ovenId }).from(ovenHealth).where(eq(ovenHealth.ovenId, o.id));
    if (state && health) continue;
    await db.transaction(async (tx) => {
      await recomputeOven(tx, o.id);
      const alert = await refreshHealth(tx, o.id, now);
      // The story's open drift investigation on L2-RF1 answers this alert.
      if (alert && o.tag === "L2-RF1") {
        const [wo] = await tx.select({ id: workOrders.id }).from(workOrders).where(and(eq(workOrders.ovenId, o.id), eq(workOrders.kind, "drift_investigation")));
        if (wo) await tx.update(alerts).set({ workOrderId: wo.id }).where(eq(alerts.id, alert.id));
      }
    });
  }
  return { changes: created };
}
