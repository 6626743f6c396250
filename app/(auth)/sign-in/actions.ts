"use server";
import { AuthError, CredentialsSignin } from "next-auth";
import { redirect } from "next/navigation";
import { headers } from "next/headers";
import { signIn } from "@/lib/auth";
import { getDb } from "@/db";
import { getUserByEmail } from "@/db/queries/users";
import { lockedMessage } from "@/lib/auth/lockout";
import { signInAllowed, signInLimitedMessage } from "@/lib/auth/sign-in-limit";
import { fieldErrors } from "@/lib/errors";
import { magicLinkSchema, passwordSignInSchema } from "@/lib/validation/user";
import { isNextControlFlow, type ActionResult } from "@/lib/action";

// Sign-in actions are the only public ones: they exist to establish who the user is.

const safeNext = (v: unknown) => (typeof v === "string" && v.startsWith("/") && !v.startsWith("//") ? v : "/fleet");

/** Refused before anything is checked or sent when this address has used up its attempts. */
async function rateLimited(): Promise<ActionResult<null> | null> {
  const gate = signInAllowed(await headers());
  return gate.allowed ? null : { ok: false, code: "rate_limited", message: signInLimitedMessage(gate.retryAfterMs) };
}

export async function passwordSignInAction(_prev: ActionResult<null> | null, form: FormData): Promise<ActionResult<null>> {
  const parsed = passwordSignInSchema.safeParse({ email: form.get("email"), password: form.get("password") });
  if (!parsed.success) return { ok: false, code: "invalid_input", message: "Enter your e-mail and password.", fields: fieldErrors(parsed.error.issues) };
  const limited = await rateLimited();
  if (limited) return limited;
  try {
    await signIn("credentials", { ...parsed.data, redirectTo: safeNext(form.get("next")) });
    return { ok: true, data: null };
  } catch (err) {
    if (isNextControlFlow(err)) throw err;
    if (err instanceof CredentialsSignin && err.code === "rate_limited") return (await rateLimited()) ?? { ok: false, code: "rate_limited", message: signInLimitedMessage(60_000) };
    if (err instanceof CredentialsSignin && err.code === "locked") {
      const user = await getUserByEmail(await getDb(), parsed.data.email);
      return { ok: false, code: "rate_limited", message: lockedMessage(user?.lockedUntil ?? new Date(Date.now() + 15 * 60_000)) };
    }
    if (err instanceof AuthError) return { ok: false, code: "unauthorized", message: "That e-mail and password do not match an active account. Check both and try again." };
    throw err;
  }
}

export async function magicLinkAction(_prev: ActionResult<null> | null, form: FormData): Promise<ActionResult<null>> {
  const parsed = magicLinkSchema.safeParse({ email: form.get("email") });
  if (!parsed.success) return { ok: false, code: "invalid_input", message: "Enter your e-mail address.", fields: fieldErrors(parsed.error.issues) };
  const limited = await rateLimited();
  if (limited) return limited;
  try {
    await signIn("nodemailer", { email: parsed.data.email, redirectTo: safeNext(form.get("next")) });
  } catch (err) {
    if (isNextControlFlow(err)) throw err;
    // Unknown or deactivated addresses are refused by the signIn callback. Say the same thing as
    // for a real account, so the form does not reveal who has one.
    if (!(err instanceof AuthError)) throw err;
  }
  redirect("/sign-in/check-email");
}
