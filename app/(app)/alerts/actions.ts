"use server";
import { revalidatePath } from "next/cache";
import { invokeAction } from "@/lib/action-invoke";
import type { ActionResult } from "@/lib/action";
import { acknowledgeAlertDef } from "@/lib/actions/drift";

export async function acknowledgeAlertAction(_prev: ActionResult<unknown> | null, form: FormData) {
  const result = await invokeAction(acknowledgeAlertDef, form);
  if (result.ok) {
    revalidatePath("/alerts");
    revalidatePath("/fleet");
  }
  return result.ok ? { ...result, message: result.data.workOrderId ? `Acknowledged; work order ${result.data.workOrderId} opened.` : "Acknowledged." } : result;
}
