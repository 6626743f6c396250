import "server-only";
import type { z } from "zod";
import { getDb } from "@/db";
import type { Db } from "@/db/client";
import type { Actor } from "./actor";
import { AppError, fieldErrors, forbidden, unauthorized } from "./errors";
import { can, type Permission } from "./permissions";

export type ActionResult<T = unknown> =
  | { ok: true; data: T; message?: string }
  | { ok: false; code: string; message: string; fields?: Record<string, string> };

export type ActionDef<S extends z.ZodType, R> = {
  name: string;
  permission: Permission;
  schema: S;
  run: (ctx: { actor: Actor; db: Db; input: z.infer<S> }) => Promise<R>;
};

// Every action definition registers itself, so the role-matrix test can enumerate them all.
export const ACTION_REGISTRY = new Map<string, ActionDef<z.ZodType, unknown>>();

export function defineAction<S extends z.ZodType, R>(def: ActionDef<S, R>): ActionDef<S, R> {
  ACTION_REGISTRY.set(def.name, def as unknown as ActionDef<z.ZodType, unknown>);
  return def;
}

export function formDataToObject(input: FormData | Record<string, unknown>): Record<string, unknown> {
  if (!(input instanceof FormData)) return input;
  const out: Record<string, unknown> = {};
  for (const [key, value] of input.entries()) {
    if (key.startsWith("$ACTION")) continue;
    // Defined, not assigned: a field named "__proto__" must stay a field, not become the
    // object's prototype (a File there made every later read throw).
    Object.defineProperty(out, key, { value, enumerable: true, writable: true, configurable: true });
  }
  return out;
}

/**
 * Runs an action for an actor: authenticate, check the permission, validate, run.
 * Every outcome is a result the form can show; nothing but Next's redirects escapes.
 */
export async function runAction<S extends z.ZodType, R>(def: ActionDef<S, R>, actor: Actor | null, raw: FormData | Record<string, unknown>, db?: Db): Promise<ActionResult<R>> {
  try {
    if (!actor) throw unauthorized();
    if (!can(actor.role, def.permission)) throw forbidden(def.permission.replace(".", " "));
    const parsed = def.schema.safeParse(formDataToObject(raw));
    if (!parsed.success) {
      const fields = fieldErrors(parsed.error.issues);
      return { ok: false, code: "invalid_input", message: "Some fields need attention.", fields };
    }
    const data = await def.run({ actor, db: db ?? (await getDb()), input: parsed.data });
    return { ok: true, data };
  } catch (err) {
    if (err instanceof AppError) {
      return { ok: false, code: err.code, message: err.message, fields: (err.details?.fields as Record<string, string>) ?? undefined };
    }
    if (isNextControlFlow(err)) throw err;
    console.error(`[action ${def.name}]`, err);
    return { ok: false, code: "internal", message: "Something went wrong on the server. It has been logged; try again." };
  }
}

export function isNextControlFlow(err: unknown): boolean {
  const digest = (err as { digest?: unknown })?.digest;
  return typeof digest === "string" && (digest.startsWith("NEXT_REDIRECT") || digest.startsWith("NEXT_NOT_FOUND") || digest.startsWith("NEXT_HTTP_ERROR"));
}
