"use server";
import { revalidatePath } from "next/cache";
import { invokeAction } from "@/lib/action-invoke";
import type { ActionResult } from "@/lib/action";
import { createLineDef, createSiteDef, createTokenDef, inviteUserDef, revokeTokenDef, updateUserAccessDef } from "@/lib/actions/admin";

type R<T> = ActionResult<T> | null;

export async function inviteUserAction(_prev: R<unknown>, form: FormData) {
  const result = await invokeAction(inviteUserDef, form);
  if (result.ok) revalidatePath("/settings/people");
  return result.ok ? { ...result, message: `Invitation sent to ${result.data.email}.` } : result;
}

export async function updateUserAccessAction(_prev: R<unknown>, form: FormData) {
  const result = await invokeAction(updateUserAccessDef, form);
  if (result.ok) revalidatePath("/settings/people");
  return result.ok ? { ...result, message: "Saved." } : result;
}

export async function createTokenAction(_prev: R<unknown>, form: FormData) {
  const result = await invokeAction(createTokenDef, form);
  if (result.ok) revalidatePath("/settings/tokens");
  return result;
}

export async function revokeTokenAction(_prev: R<unknown>, form: FormData) {
  const result = await invokeAction(revokeTokenDef, form);
  if (result.ok) revalidatePath("/settings/tokens");
  return result.ok ? { ...result, message: "Token revoked. Anything using it now gets 401." } : result;
}

export async function createSiteAction(_prev: R<unknown>, form: FormData) {
  const result = await invokeAction(createSiteDef, form);
  if (result.ok) revalidatePath("/settings/sites");
  return result.ok ? { ...result, message: "Site added." } : result;
}

export async function createLineAction(_prev: R<unknown>, form: FormData) {
  const result = await invokeAction(createLineDef, form);
  if (result.ok) revalidatePath("/settings/sites");
  return result.ok ? { ...result, message: "Line added." } : result;
}
