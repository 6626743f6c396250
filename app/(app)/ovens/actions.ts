"use server";
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { invokeAction } from "@/lib/action-invoke";
import type { ActionResult } from "@/lib/action";
import { createOvenDef, retireOvenDef, updateOvenDef } from "@/lib/actions/ovens";

export async function createOvenAction(_prev: ActionResult<{ id: number }> | null, form: FormData) {
  const result = await invokeAction(createOvenDef, form);
  if (result.ok) {
    revalidatePath("/fleet");
    redirect(`/ovens/${result.data.id}/setup`);
  }
  return result;
}

export async function updateOvenAction(_prev: ActionResult<{ id: number }> | null, form: FormData) {
  const result = await invokeAction(updateOvenDef, form);
  if (result.ok) {
    revalidatePath("/fleet");
    revalidatePath(`/ovens/${result.data.id}`, "layout");
    redirect(`/ovens/${result.data.id}/setup`);
  }
  return result;
}

export async function retireOvenAction(_prev: ActionResult<{ id: number }> | null, form: FormData) {
  const result = await invokeAction(retireOvenDef, form);
  if (result.ok) {
    revalidatePath("/fleet");
    revalidatePath(`/ovens/${result.data.id}`, "layout");
  }
  return result;
}
