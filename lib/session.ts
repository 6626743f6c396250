import "server-only";
import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { auth } from "./auth";
import { getDb } from "@/db";
import { getUserById } from "@/db/queries/users";
import { actorFromToken } from "@/db/queries/api-tokens";
import type { Actor } from "./actor";
import { can, type Permission } from "./permissions";

/** The signed-in person, read fresh from the database so role changes and deactivation apply at once. */
export async function getSessionActor(): Promise<Actor | null> {
  const session = await auth();
  const id = session?.user?.id;
  if (!id) return null;
  const user = await getUserById(await getDb(), id);
  if (!user || !user.active) return null;
  return { kind: "session", userId: user.id, tokenId: null, email: user.email, name: user.name, role: user.role };
}

/** A bearer token wins over the cookie when both are sent: loggers and scripts say who they are. */
export async function getRequestActor(authorization: string | null): Promise<Actor | null> {
  const m = authorization ? /^Bearer\s+(\S+)$/i.exec(authorization) : null;
  if (m) return actorFromToken(await getDb(), m[1]);
  return getSessionActor();
}

export async function getActor(): Promise<Actor | null> {
  return getRequestActor((await headers()).get("authorization"));
}

export async function requireUser(): Promise<Actor> {
  const actor = await getSessionActor();
  if (!actor) redirect("/sign-in");
  return actor;
}

/** For pages: signed-out users go to sign-in; a role without the permission sees the no-access page. */
export async function requirePermission(permission: Permission): Promise<Actor> {
  const actor = await requireUser();
  if (!can(actor.role, permission)) redirect(`/no-access?need=${encodeURIComponent(permission)}`);
  return actor;
}
