import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { renderMail } from "./mail-render";
import type { ReactElement } from "react";
import { env } from "./env";

/**
 * Transport timeouts well inside the outbox's SENDING_TIMEOUT_MS (lib/jobs/drain.ts): a send
 * gives up after about two minutes at most; nodemailer's defaults allow a 10-minute idle socket.
 */
export const SMTP_TIMEOUTS = { connectionTimeout: 30_000, greetingTimeout: 30_000, socketTimeout: 60_000 } as const;

// One transport per process, built from the validated SMTP_URL (the local sink by default).
const g = globalThis as unknown as { __ovenwardMail?: Transporter };

/** The process's transport, also used by the scheduler's drain. */
export function mailTransport(): Transporter {
  return transport();
}

function transport(): Transporter {
  g.__ovenwardMail ??= nodemailer.createTransport({ url: env().SMTP_URL, ...SMTP_TIMEOUTS });
  return g.__ovenwardMail;
}

export type OutgoingMail = { to: string; subject: string; element: ReactElement; headers?: Record<string, string> };

export async function sendMail(mail: OutgoingMail) {
  const { html, text } = await renderMail(mail.element);
  const info = await transport().sendMail({ from: env().MAIL_FROM, to: mail.to, subject: mail.subject, html, text, headers: mail.headers });
  return { messageId: info.messageId, response: info.response };
}
