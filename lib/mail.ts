import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { renderMail } from "./mail-render";
import type { ReactElement } from "react";
import { env } from "./env";

// One transport per process, built from the validated SMTP_URL (the local sink by default).
const g = globalThis as unknown as { __ovenwardMail?: Transporter };

/** The process's transport, also used by the scheduler's drain. */
export function mailTransport(): Transporter {
  return transport();
}

function transport(): Transporter {
  g.__ovenwardMail ??= nodemailer.createTransport(env().SMTP_URL);
  return g.__ovenwardMail;
}

export type OutgoingMail = { to: string; subject: string; element: ReactElement; headers?: Record<string, string> };

export async function sendMail(mail: OutgoingMail) {
  const { html, text } = await renderMail(mail.element);
  const info = await transport().sendMail({ from: env().MAIL_FROM, to: mail.to, subject: mail.subject, html, text, headers: mail.headers });
  return { messageId: info.messageId, response: info.response };
}
