import "server-only";
import bcrypt from "bcryptjs";
import { and, asc, eq, gt, isNull } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { users, userTokens, type Role, type UserRow } from "../schema/users";
import { AFTER_SUCCESS, afterFailure, isLocked } from "@/lib/auth/lockout";
import { newSecret, sha256 } from "@/lib/secrets";
import { recordAudit } from "./audit";
import type { Actor } from "@/lib/actor";
import { AppError, notFound } from "@/lib/errors";

export const normaliseEmail = (email: string) => email.trim().toLowerCase();

export async function getUserByEmail(db: DbOrTx, email: string) {
  const [row] = await db.select().from(users).where(eq(users.email, normaliseEmail(email))).limit(1);
  return row ?? null;
}

export async function getUserById(db: DbOrTx, id: string) {
  const [row] = await db.select().from(users).where(eq(users.id, id)).limit(1);
  return row ?? null;
}

export async function listUsers(db: DbOrTx) {
  return db.select().from(users).orderBy(asc(users.email));
}

export function publicUser(u: UserRow) {
  return { id: u.id, email: u.email, name: u.name, role: u.role, active: u.active };
}

let dummyHash: string | undefined;

export type PasswordCheck = { kind: "ok"; user: UserRow } | { kind: "locked"; until: Date } | { kind: "bad"; delayMs: number };

/** Checks a password and keeps the per-account failure count that slows and then locks sign-in. */
export async function checkPassword(db: Db, email: string, password: string, now = new Date()): Promise<PasswordCheck> {
  const user = await getUserByEmail(db, email);
  if (!user || !user.active || !user.passwordHash) {
    // Same cost as a real comparison, so the answer time does not reveal which accounts exist.
    dummyHash ??= await bcrypt.hash("not-a-password", 10);
    await bcrypt.compare(password, dummyHash);
    return { kind: "bad", delayMs: 0 };
  }
  if (isLocked(user, now)) return { kind: "locked", until: user.lockedUntil! };
  if (await bcrypt.compare(password, user.passwordHash)) {
    if (user.failedSignIns > 0 || user.lockedUntil) await db.update(users).set(AFTER_SUCCESS).where(eq(users.id, user.id));
    return { kind: "ok", user };
  }
  const next = afterFailure(user, now);
  await db
    .update(users)
    .set({ failedSignIns: next.failedSignIns, lastFailedSignInAt: next.lastFailedSignInAt, lockedUntil: next.lockedUntil })
    .where(eq(users.id, user.id));
  if (isLocked(next, now)) return { kind: "locked", until: next.lockedUntil! };
  return { kind: "bad", delayMs: next.delayMs };
}

export const hashPassword = (password: string) => bcrypt.hash(password, 10);

export async function inviteUser(db: Db, input: { email: string; name?: string; role: Role }, actor: Actor) {
  const email = normaliseEmail(input.email);
  if (await getUserByEmail(db, email)) throw new AppError("conflict", `${email} already has an account.`, { fields: { email: "already has an account" } });
  const secret = newSecret("owi");
  const user = await db.transaction(async (tx) => {
    const [created] = await tx.insert(users).values({ email, name: input.name ?? null, role: input.role }).returning();
    await tx.insert(userTokens).values({
      userId: created.id,
      purpose: "invite",
      tokenHash: sha256(secret),
      expiresAt: new Date(Date.now() + 7 * 24 * 3600_000),
    });
    await recordAudit(tx, { actor, action: "user.invite", entity: "user", entityId: created.id, after: publicUser(created) });
    return created;
  });
  return { user, secret };
}

/**
 * Takes back an invitation whose e-mail could not be sent: the account (never used: no password)
 * and its invite token go, and the audit log says why, so the admin can simply try again.
 */
export async function withdrawInvite(db: Db, userId: string, reason: string, actor: Actor) {
  await db.transaction(async (tx) => {
    const [gone] = await tx.delete(users).where(and(eq(users.id, userId), isNull(users.passwordHash))).returning();
    if (gone) await recordAudit(tx, { actor, action: "user.invite_withdrawn", entity: "user", entityId: userId, before: publicUser(gone), after: { reason } });
  });
}

export async function findInvite(db: DbOrTx, secret: string) {
  const [row] = await db
    .select({ token: userTokens, user: users })
    .from(userTokens)
    .innerJoin(users, eq(users.id, userTokens.userId))
    .where(and(eq(userTokens.tokenHash, sha256(secret)), isNull(userTokens.usedAt), gt(userTokens.expiresAt, new Date())))
    .limit(1);
  return row ?? null;
}

export async function acceptInvite(db: Db, secret: string, password: string) {
  const found = await findInvite(db, secret);
  if (!found) throw new AppError("not_found", "This invitation link has expired or was already used. Ask an admin for a new one.");
  const passwordHash = await hashPassword(password);
  await db.transaction(async (tx) => {
    await tx.update(userTokens).set({ usedAt: new Date() }).where(eq(userTokens.id, found.token.id));
    await tx.update(users).set({ passwordHash, emailVerified: new Date(), updatedAt: new Date() }).where(eq(users.id, found.user.id));
    await recordAudit(tx, { actor: null, action: "user.accept_invite", entity: "user", entityId: found.user.id });
  });
  return found.user;
}

export async function updateUserAccess(db: Db, id: string, patch: { role?: Role; active?: boolean }, actor: Actor) {
  if (id === actor.userId && (patch.active === false || (patch.role && patch.role !== "admin")))
    throw new AppError("conflict", "You cannot remove your own admin access; ask another admin.");
  return db.transaction(async (tx) => {
    const before = await getUserById(tx, id);
    if (!before) throw notFound("That user");
    const [after] = await tx.update(users).set({ ...patch, updatedAt: new Date() }).where(eq(users.id, id)).returning();
    await recordAudit(tx, { actor, action: "user.update", entity: "user", entityId: id, before: publicUser(before), after: publicUser(after) });
    return after;
  });
}
