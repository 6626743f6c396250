"use server";
import { redirect } from "next/navigation";
import { getDb } from "@/db";
import { acceptInvite } from "@/db/queries/users";
import { AppError, fieldErrors } from "@/lib/errors";
import { setPasswordSchema } from "@/lib/validation/user";
import type { ActionResult } from "@/lib/action";

// Public on purpose: the invitation secret in the link is the credential.
export async function acceptInviteAction(_prev: ActionResult<null> | null, form: FormData): Promise<ActionResult<null>> {
  const parsed = setPasswordSchema.safeParse(Object.fromEntries(form.entries()));
  if (!parsed.success) return { ok: false, code: "invalid_input", message: "Some fields need attention.", fields: fieldErrors(parsed.error.issues) };
  try {
    await acceptInvite(await getDb(), parsed.data.token, parsed.data.password);
  } catch (err) {
    if (err instanceof AppError) return { ok: false, code: err.code, message: err.message };
    throw err;
  }
  redirect("/sign-in?invited=1");
}
