"use server";
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { invokeAction } from "@/lib/action-invoke";
import type { ActionResult } from "@/lib/action";
import { deleteRunDef, rejudgeRunDef } from "@/lib/actions/measurement";

export async function rejudgeRunAction(_prev: ActionResult<unknown> | null, form: FormData) {
  const result = await invokeAction(rejudgeRunDef, form);
  if (result.ok) {
    revalidatePath(`/runs/${result.data.runId}`);
    return { ...result, message: `Re-judged: ${result.data.status}. The original verdict is kept below.` };
  }
  return result;
}

export async function deleteRunAction(_prev: ActionResult<unknown> | null, form: FormData) {
  const ovenId = String(form.get("ovenId") ?? "");
  const result = await invokeAction(deleteRunDef, form);
  if (result.ok) {
    revalidatePath("/runs");
    redirect(ovenId ? `/ovens/${ovenId}/runs` : "/runs");
  }
  return result;
}
