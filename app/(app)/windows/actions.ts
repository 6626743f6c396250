"use server";
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { invokeAction } from "@/lib/action-invoke";
import type { ActionResult } from "@/lib/action";
import { createBoardDef, createWindowDef, updateBoardDef, updateWindowDef } from "@/lib/actions/measurement";

export async function createWindowAction(_prev: ActionResult<unknown> | null, form: FormData) {
  const result = await invokeAction(createWindowDef, form);
  if (result.ok) {
    revalidatePath("/windows");
    redirect(`/windows/${result.data.id}`);
  }
  return result;
}

export async function updateWindowAction(_prev: ActionResult<unknown> | null, form: FormData) {
  const result = await invokeAction(updateWindowDef, form);
  if (result.ok) {
    revalidatePath("/windows");
    revalidatePath(`/windows/${result.data.id}`);
    return { ...result, message: `Saved as version ${result.data.version}. Runs already judged keep the values they were judged with.` };
  }
  return result;
}

export async function createBoardAction(_prev: ActionResult<unknown> | null, form: FormData) {
  const result = await invokeAction(createBoardDef, form);
  if (result.ok) {
    revalidatePath("/windows/boards");
    return { ...result, message: "Test board added." };
  }
  return result;
}

export async function updateBoardAction(_prev: ActionResult<unknown> | null, form: FormData) {
  const result = await invokeAction(updateBoardDef, form);
  if (result.ok) {
    revalidatePath("/windows/boards");
    return { ...result, message: "Test board saved." };
  }
  return result;
}
