"use server";
import { revalidatePath } from "next/cache";
import { invokeAction } from "@/lib/action-invoke";
import type { ActionResult } from "@/lib/action";
import { setBaselineByDatesDef, setDriftSettingsDef } from "@/lib/actions/drift";

export async function setDriftSettingsAction(_prev: ActionResult<unknown> | null, form: FormData) {
  const result = await invokeAction(setDriftSettingsDef, form);
  if (result.ok) revalidatePath(`/ovens/${result.data.ovenId}`, "layout");
  return result.ok ? { ...result, message: "Saved; the charts were rebuilt with these settings." } : result;
}

export async function setBaselineByDatesAction(_prev: ActionResult<unknown> | null, form: FormData) {
  const result = await invokeAction(setBaselineByDatesDef, form);
  if (result.ok) revalidatePath(`/ovens/${result.data.ovenId}`, "layout");
  return result.ok ? { ...result, message: `Baseline set from ${result.data.n} runs; drift rebuilt.` } : result;
}
