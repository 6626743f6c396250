"use server";
import { revalidatePath } from "next/cache";
import { invokeAction } from "@/lib/action-invoke";
import type { ActionResult } from "@/lib/action";
import { updateMailTimeZoneDef, updateSubscriptionDef } from "@/lib/actions/mail";

type R<T> = ActionResult<T> | null;

export async function updateSubscriptionAction(_prev: R<unknown>, form: FormData) {
  const result = await invokeAction(updateSubscriptionDef, form);
  if (result.ok) revalidatePath("/settings/notifications");
  return result.ok ? { ...result, message: result.data.enabled ? "Saved. The next one follows this schedule." : "Saved. This e-mail is off." } : result;
}

export async function updateMailTimeZoneAction(_prev: R<unknown>, form: FormData) {
  const result = await invokeAction(updateMailTimeZoneDef, form);
  if (result.ok) revalidatePath("/settings/notifications");
  return result.ok ? { ...result, message: `Times are now read in ${result.data.timeZone}.` } : result;
}
