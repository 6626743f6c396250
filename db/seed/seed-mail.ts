import { inArray } from "drizzle-orm";
import type { Db } from "../client";
import { users } from "../schema/users";
import { ensureDefaultSubscriptions } from "../queries/subscriptions";
import { DEMO_USERS } from "./demo-plant";

const DAY_MS = 86_400_000;

/**
 * Default e-mail subscriptions by role for the demo people. Idempotent: a kind a person already
 * has a row for is left alone. The rows count as created eight days before `now` (rounded to
 * the day), so the first tick after seeding sends each scheduled e-mail's latest occurrence —
 * the demo's outbox then shows a Monday digest and the morning lists.
 */
export async function seedMail(db: Db, { now = new Date() }: { now?: Date } = {}) {
  const createdAt = new Date(Math.floor(now.getTime() / DAY_MS) * DAY_MS - 8 * DAY_MS);
  const people = await db.select({ id: users.id, role: users.role }).from(users).where(inArray(users.email, DEMO_USERS.map((u) => u.email)));
  let subscriptions = 0;
  for (const p of people) subscriptions += await ensureDefaultSubscriptions(db, p, createdAt);
  return { subscriptions };
}
