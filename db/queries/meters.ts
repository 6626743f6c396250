import "server-only";
import { and, desc, eq } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { meterReadings, type MeterKind } from "../schema/maintenance";
import { recordAudit } from "./audit";
import { requireOven } from "./ovens";
import type { Actor } from "@/lib/actor";
import { AppError } from "@/lib/errors";
import { validateMeterReading } from "@/lib/maintenance/usage-triggers";
import type { MeterReadingInput } from "@/lib/validation/maintenance";

export async function listMeterReadings(db: DbOrTx, ovenId: number, limit = 20) {
  return db.select().from(meterReadings).where(eq(meterReadings.ovenId, ovenId)).orderBy(desc(meterReadings.at)).limit(limit);
}

async function latest(db: DbOrTx, ovenId: number, kind: MeterKind) {
  const [r] = await db
    .select({ at: meterReadings.at, value: meterReadings.value })
    .from(meterReadings)
    .where(and(eq(meterReadings.ovenId, ovenId), eq(meterReadings.kind, kind)))
    .orderBy(desc(meterReadings.at))
    .limit(1);
  return r ?? null;
}

/** Records a reading; a meter only counts up (validateMeterReading says why one is refused). */
export async function recordMeterReading(db: Db, ovenId: number, input: MeterReadingInput, actor: Actor, now = new Date()) {
  await requireOven(db, ovenId);
  const at = input.at ?? now;
  return db.transaction(async (tx) => {
    const problem = validateMeterReading(await latest(tx, ovenId, input.kind), { at, value: input.value }, now);
    if (problem) {
      const text = input.kind === "heater_hours" ? problem : problem.replace(/ h\b/g, "");
      throw new AppError("invalid_input", `value: ${text}`, { fields: { value: text } });
    }
    const [row] = await tx.insert(meterReadings).values({ ovenId, kind: input.kind, value: input.value, at, recordedById: actor.userId }).returning();
    await recordAudit(tx, { actor, action: "meter.record", entity: "meter_reading", entityId: row.id, after: row });
    return { id: row.id, ovenId, kind: row.kind, value: row.value, at: row.at.toISOString() };
  });
}
