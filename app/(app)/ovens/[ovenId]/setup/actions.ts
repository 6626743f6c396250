"use server";
import { revalidatePath } from "next/cache";
import { invokeAction } from "@/lib/action-invoke";
import type { ActionResult } from "@/lib/action";
import { setOvenDefaultsDef } from "@/lib/actions/measurement";

export async function setOvenDefaultsAction(_prev: ActionResult<unknown> | null, form: FormData) {
  const result = await invokeAction(setOvenDefaultsDef, form);
  if (result.ok) {
    revalidatePath(`/ovens/${result.data.id}`, "layout");
    return { ...result, message: "Saved. New runs on this oven start with this window and board." };
  }
  return result;
}
