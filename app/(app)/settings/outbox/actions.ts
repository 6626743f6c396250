"use server";
import { revalidatePath } from "next/cache";
import { invokeAction } from "@/lib/action-invoke";
import type { ActionResult } from "@/lib/action";
import { resendOutboxDef } from "@/lib/actions/mail";

export async function resendOutboxAction(_prev: ActionResult<unknown> | null, form: FormData) {
  const result = await invokeAction(resendOutboxDef, form);
  if (result.ok) revalidatePath("/settings/outbox");
  return result.ok ? { ...result, message: "Queued again; the next tick sends it." } : result;
}
