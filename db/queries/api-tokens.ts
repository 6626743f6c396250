import "server-only";
import { and, desc, eq, isNull } from "drizzle-orm";
import type { Db, DbOrTx } from "../client";
import { apiTokens } from "../schema/api-tokens";
import { users, type Role } from "../schema/users";
import { newSecret, sha256 } from "@/lib/secrets";
import { recordAudit } from "./audit";
import type { Actor } from "@/lib/actor";
import { AppError, notFound } from "@/lib/errors";
import { ROLES } from "../schema/users";

const rank = (r: Role) => ROLES.indexOf(r);

/** Creates a token for a user. Its role is the user's, or a lower one if asked; never higher. */
export async function createApiToken(db: Db, input: { userId: string; name: string; role?: Role }, actor: Actor | null) {
  const [user] = await db.select().from(users).where(eq(users.id, input.userId)).limit(1);
  if (!user || !user.active) throw notFound("That user");
  const role = input.role ?? user.role;
  if (rank(role) > rank(user.role)) throw new AppError("invalid_input", `A token cannot carry more than its user's role (${user.role}).`, { fields: { role: "higher than the user's role" } });
  const secret = newSecret("ow");
  const row = await db.transaction(async (tx) => {
    const [created] = await tx
      .insert(apiTokens)
      .values({ userId: user.id, name: input.name, role, prefix: secret.slice(0, 10), tokenHash: sha256(secret) })
      .returning();
    await recordAudit(tx, { actor, action: "token.create", entity: "api_token", entityId: created.id, after: { name: created.name, role, userId: user.id } });
    return created;
  });
  return { token: row, secret };
}

export async function revokeApiToken(db: Db, id: number, actor: Actor) {
  return db.transaction(async (tx) => {
    const [row] = await tx.update(apiTokens).set({ revokedAt: new Date() }).where(and(eq(apiTokens.id, id), isNull(apiTokens.revokedAt))).returning();
    if (!row) throw notFound("An active token with that id");
    await recordAudit(tx, { actor, action: "token.revoke", entity: "api_token", entityId: id });
    return row;
  });
}

export async function listApiTokens(db: DbOrTx) {
  return db
    .select({ id: apiTokens.id, name: apiTokens.name, role: apiTokens.role, prefix: apiTokens.prefix, createdAt: apiTokens.createdAt, lastUsedAt: apiTokens.lastUsedAt, revokedAt: apiTokens.revokedAt, email: users.email })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .orderBy(desc(apiTokens.id));
}

/** Resolves a bearer secret to an actor, or null. A token of a deactivated user is dead too. */
export async function actorFromToken(db: Db, secret: string): Promise<Actor | null> {
  const [row] = await db
    .select({ token: apiTokens, user: users })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(eq(apiTokens.tokenHash, sha256(secret)))
    .limit(1);
  if (!row || row.token.revokedAt || !row.user.active) return null;
  const now = Date.now();
  // Recording every use would turn each read into a write; once a minute is enough to show activity.
  if (!row.token.lastUsedAt || now - row.token.lastUsedAt.getTime() > 60_000) {
    await db.update(apiTokens).set({ lastUsedAt: new Date(now) }).where(eq(apiTokens.id, row.token.id));
  }
  const role = rank(row.token.role) <= rank(row.user.role) ? row.token.role : row.user.role;
  return { kind: "token", userId: row.user.id, tokenId: row.token.id, email: row.user.email, name: row.user.name, role };
}
