import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { lines, ovens } from "@/db/schema/fleet";
import { users } from "@/db/schema/users";
import { apiTokens } from "@/db/schema/api-tokens";
import { outbox } from "@/db/schema/mail";
import type { Role } from "@/db/schema/users";

// A valid input per server action, for the role matrix. Each call makes fresh names, so the
// roles that are allowed succeed one after another without colliding.
let n = 0;
const uid = () => `${Date.now().toString(36)}${(n++).toString(36)}`.toUpperCase();

async function anyLine(db: Db) {
  const [l] = await db.select().from(lines).limit(1);
  return l.id;
}
async function anyOven(db: Db) {
  const [o] = await db.select().from(ovens).where(eq(ovens.tag, "LAB-B2"));
  return o.id;
}
async function scratchOven(db: Db) {
  const [o] = await db.insert(ovens).values({ tag: `SCR-${uid()}`, name: "scratch", lineId: await anyLine(db), kind: "other" }).returning();
  return o.id;
}
async function userId(db: Db, email: string) {
  const [u] = await db.select().from(users).where(eq(users.email, email));
  return u.id;
}

const ownEmail = (role: Role) => (role === "technician" ? "tech@brightwater.example" : `${role}@brightwater.example`);

export const ACTION_INPUTS: Record<string, (db: Db, role: Role) => Promise<Record<string, unknown>>> = {
  createOven: async (db) => ({ tag: `A-${uid()}`, name: "Action oven", lineId: String(await anyLine(db)), kind: "convection", zones: "8" }),
  updateOven: async (db) => ({ ovenId: String(await anyOven(db)), notes: `edited ${uid()}` }),
  retireOven: async (db) => ({ ovenId: String(await scratchOven(db)) }),
  inviteUser: async () => ({ email: `invitee.${uid().toLowerCase()}@brightwater.example`, role: "viewer" }),
  updateUserAccess: async (db) => ({ userId: await userId(db, "viewer@brightwater.example"), role: "viewer" }),
  createApiToken: async (db) => ({ userId: await userId(db, "tech@brightwater.example"), name: `t-${uid()}` }),
  revokeApiToken: async (db) => {
    const [t] = await db.insert(apiTokens).values({ userId: await userId(db, "tech@brightwater.example"), name: "r", role: "technician", prefix: "ow_x", tokenHash: uid() }).returning();
    return { tokenId: String(t.id) };
  },
  createChange: async (db) => ({ ovenId: String(await anyOven(db)), at: new Date(Date.now() - 60_000).toISOString(), area: "baffle", summary: `Baffle ${uid()}`, after: "plate B" }),
  updateSubscription: async (db, role) => ({ userId: await userId(db, ownEmail(role)), kind: "fleet_digest", enabled: "on", sendAt: "07:30", day_MO: "on" }),
  updateMailTimeZone: async (db, role) => ({ userId: await userId(db, ownEmail(role)), timeZone: "Europe/Dublin" }),
  resendOutboxMessage: async (db) => {
    const key = `matrix:${uid()}`;
    const [row] = await db.insert(outbox).values({ kind: "fleet_digest", to: "viewer@brightwater.example", subject: "m", html: "<p>m</p>", text: "m", headers: {}, idempotencyKey: key, state: "dead", nextAttemptAt: new Date(), createdAt: new Date() }).returning();
    return { outboxId: String(row.id) };
  },
  createSite: async () => ({ name: `Site ${uid()}`, timeZone: "America/Chicago" }),
  createLine: async (db) => {
    const [l] = await db.select().from(lines).limit(1);
    return { siteId: String(l.siteId), name: `Line ${uid()}`, kind: "smt" };
  },
};
