"use server";
import { revalidatePath } from "next/cache";
import { invokeAction } from "@/lib/action-invoke";
import type { ActionResult } from "@/lib/action";
import { createChangeDef } from "@/lib/actions/changes";

export async function createChangeAction(_prev: ActionResult<unknown> | null, form: FormData) {
  const result = await invokeAction(createChangeDef, form);
  if (result.ok) {
    revalidatePath(`/ovens/${result.data.ovenId}`, "layout");
    revalidatePath("/changes");
  }
  return result.ok ? { ...result, message: "Change logged. It now marks the oven's trend charts." } : result;
}
