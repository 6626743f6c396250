import "server-only";
import type { z } from "zod";
import { getActor } from "./session";
import { runAction, type ActionDef, type ActionResult } from "./action";

/** What a "use server" function calls: the actor comes from the request, never from the client. */
export async function invokeAction<S extends z.ZodType, R>(def: ActionDef<S, R>, raw: FormData | Record<string, unknown>): Promise<ActionResult<R>> {
  return runAction(def, await getActor(), raw);
}
