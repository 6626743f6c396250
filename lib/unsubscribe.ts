import "server-only";
import type { DbOrTx } from "@/db/client";
import { MAIL_KINDS, type MailKind } from "@/db/schema/mail";
import { getUserById } from "@/db/queries/users";
import { unsubscribe } from "@/db/queries/subscriptions";
import { AppError } from "./errors";
import { verifyUnsubscribeToken } from "./mail-token";

const REASONS = {
  malformed: "This unsubscribe link is incomplete. Copy the whole link from the e-mail, or change your e-mails in Settings.",
  bad_signature: "This unsubscribe link is not one Ovenward made. Copy the whole link from the e-mail, or change your e-mails in Settings.",
  expired: "This unsubscribe link has expired. Use the link in a newer e-mail, or change your e-mails in Settings.",
} as const;

/** Checks a token without changing anything (for the confirmation page). */
export async function readUnsubscribeToken(db: DbOrTx, token: string, now = new Date()) {
  const v = verifyUnsubscribeToken(token, now);
  if (!v.ok) throw new AppError("invalid_input", REASONS[v.reason], { reason: v.reason });
  if (!(MAIL_KINDS as readonly string[]).includes(v.payload.kind)) throw new AppError("invalid_input", REASONS.malformed, { reason: "malformed" });
  const user = await getUserById(db, v.payload.userId);
  if (!user) throw new AppError("not_found", "The account this link was made for no longer exists.");
  return { user, kind: v.payload.kind as MailKind };
}

/** One-click unsubscribe from a signed link: no session needed, only the kind it names stops. */
export async function unsubscribeWithToken(db: DbOrTx, token: string, now = new Date()) {
  const { user, kind } = await readUnsubscribeToken(db, token, now);
  await unsubscribe(db, user.id, kind, now);
  return { email: user.email, kind };
}
