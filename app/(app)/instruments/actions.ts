"use server";
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { invokeAction } from "@/lib/action-invoke";
import type { ActionResult } from "@/lib/action";
import { createCalibrationDef, createInstrumentDef } from "@/lib/actions/measurement";

export async function createInstrumentAction(_prev: ActionResult<unknown> | null, form: FormData) {
  const result = await invokeAction(createInstrumentDef, form);
  if (result.ok) {
    revalidatePath("/instruments");
    redirect(`/instruments/${result.data.id}`);
  }
  return result;
}

export async function createCalibrationAction(_prev: ActionResult<unknown> | null, form: FormData) {
  const result = await invokeAction(createCalibrationDef, form);
  if (result.ok) {
    revalidatePath("/instruments");
    revalidatePath(`/instruments/${result.data.instrumentId}`);
    return { ...result, message: "Calibration recorded. Runs from now on use its offsets." };
  }
  return result;
}
