import { and, asc, eq, isNull } from "drizzle-orm";
import { processWindows, testBoards } from "@/db/schema/windows";
import { instruments } from "@/db/schema/instruments";
import { runs } from "@/db/schema/runs";
import type { Db } from "@/db/client";
import { lines, ovens } from "@/db/schema/fleet";
import { users } from "@/db/schema/users";
import { apiTokens } from "@/db/schema/api-tokens";
import { outbox } from "@/db/schema/mail";
import { alerts } from "@/db/schema/drift";
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
async function firstId(db: Db, table: typeof processWindows | typeof testBoards | typeof instruments) {
  const [row] = await db.select({ id: table.id }).from(table).limit(1);
  return String(row.id);
}
/** A live run of LAB-B2, the oldest first, so each allowed role deletes a different one. */
async function liveRun(db: Db) {
  const [r] = await db.select({ id: runs.id }).from(runs).where(and(eq(runs.ovenId, Number(await anyOven(db))), isNull(runs.deletedAt))).orderBy(asc(runs.id)).limit(1);
  return String(r.id);
}
const SAC305_FIELDS = {
  liquidus: "217", peakMin: "235", peakMax: "245", talMin: "50", talMax: "70", soakStart: "150", soakEnd: "200", soakMin: "60", soakMax: "120",
  rampUpMax: "3", rampDownMax: "4", rampWindow: "10", heatUpFrom: "50", heatUpTo: "150", deltaTMax: "10", timeToPeakMax: "480",
};

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
  acknowledgeAlert: async (db) => {
    const [o] = await db.select({ id: ovens.id }).from(ovens).limit(1);
    const [a] = await db.insert(alerts).values({ ovenId: o.id, toState: "watch", reasons: ["matrix"], raisedAt: new Date() }).returning();
    return { alertId: String(a.id), note: "Checked the blower; noted." };
  },
  setBaseline: async (db) => {
    const rows = await db.select({ id: runs.id }).from(runs).where(eq(runs.ovenId, Number(await anyOven(db)))).orderBy(asc(runs.id)).limit(12);
    return { ovenId: String(await anyOven(db)), metric: "deltaTPeak", fromRunId: String(rows[0].id), toRunId: String(rows[11].id) };
  },
  setDriftSettings: async (db) => ({ ovenId: String(await anyOven(db)), lambda: "0.25", L: "3", cusumK: "0.5", cusumH: "5" }),
  setBaselineByDates: async (db) => ({ ovenId: String(await anyOven(db)), metric: "criticalSpread", from: "2020-01-01", to: "2100-01-01" }),
  createChange: async (db) => ({ ovenId: String(await anyOven(db)), at: new Date(Date.now() - 60_000).toISOString(), area: "baffle", summary: `Baffle ${uid()}`, after: "plate B" }),
  updateSubscription: async (db, role) => ({ userId: await userId(db, ownEmail(role)), kind: "fleet_digest", enabled: "on", sendAt: "07:30", day_MO: "on" }),
  updateMailTimeZone: async (db, role) => ({ userId: await userId(db, ownEmail(role)), timeZone: "Europe/Dublin" }),
  resendOutboxMessage: async (db) => {
    const key = `matrix:${uid()}`;
    const [row] = await db.insert(outbox).values({ kind: "fleet_digest", to: "viewer@brightwater.example", subject: "m", html: "<p>m</p>", text: "m", headers: {}, idempotencyKey: key, state: "dead", nextAttemptAt: new Date(), createdAt: new Date() }).returning();
    return { outboxId: String(row.id) };
  },
  createWindow: async () => ({ name: `Window ${uid()}`, presetId: "sac305-typical", ...SAC305_FIELDS }),
  updateWindow: async (db) => ({ windowId: await firstId(db, processWindows), name: `Window ${uid()}`, ...SAC305_FIELDS, deltaTMax: "9" }),
  createBoard: async () => ({ name: `Board ${uid()}`, widthMm: "120", heightMm: "80", probes: JSON.stringify([{ label: "P1", x: 10, y: 10, sitsOn: "edge" }]) }),
  updateBoard: async (db) => ({ boardId: await firstId(db, testBoards), notes: `edited ${uid()}` }),
  createInstrument: async () => ({ kind: "logger", name: `Logger ${uid()}`, serial: `SN-${uid()}`, channelCount: "8", scanSkewSeconds: "0.05" }),
  updateInstrument: async (db) => ({ instrumentId: await firstId(db, instruments), notes: `edited ${uid()}` }),
  createCalibration: async (db) => ({ instrumentId: await firstId(db, instruments), performedAt: "2026-02-01", performedBy: "Kestrel Metrology", reference: "dry-well", offsets: '{"1": 0.1}' }),
  setOvenDefaults: async (db) => ({ ovenId: String(await anyOven(db)), defaultWindowId: await firstId(db, processWindows), defaultBoardId: await firstId(db, testBoards) }),
  rejudgeRun: async (db) => ({ runId: await liveRun(db) }),
  deleteRun: async (db) => ({ runId: await liveRun(db) }),
  createSite: async () => ({ name: `Site ${uid()}`, timeZone: "America/Chicago" }),
  createLine: async (db) => {
    const [l] = await db.select().from(lines).limit(1);
    return { siteId: String(l.siteId), name: `Line ${uid()}`, kind: "smt" };
  },
};
