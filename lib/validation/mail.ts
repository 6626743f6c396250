import { z } from "zod";
import { MAIL_KINDS, OUTBOX_STATES } from "@/db/schema/mail";

const WEEKDAYS = ["MO", "TU", "WE", "TH", "FR", "SA", "SU"] as const;
const checkbox = z.preprocess((v) => v === "on" || v === "true" || v === true, z.boolean());

export const outboxQuerySchema = z.object({ state: z.enum(OUTBOX_STATES).optional() });

/** One kind's row of the e-mail settings form; weekdays come as day_MO … day_SU checkboxes. */
export const subscriptionFormSchema = z
  .object({
    userId: z.string().min(1, "is required"),
    kind: z.enum(MAIL_KINDS, { message: "is not an e-mail Ovenward sends" }),
    enabled: checkbox.default(false),
    sendAt: z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, "a time as HH:mm").optional(),
    ...Object.fromEntries(WEEKDAYS.map((d) => [`day_${d}`, checkbox.default(false)])),
  })
  .transform((v) => {
    const row = v as Record<string, unknown>;
    return { userId: v.userId, kind: v.kind, enabled: v.enabled, sendAt: v.sendAt, weekdays: WEEKDAYS.filter((d) => row[`day_${d}`] === true) };
  })
  .superRefine((v, ctx) => {
    const scheduled = v.kind === "fleet_digest" || v.kind === "my_work_daily";
    if (!scheduled) return;
    if (!v.sendAt) ctx.addIssue({ code: "custom", path: ["sendAt"], message: "a time as HH:mm" });
    if (v.weekdays.length === 0) ctx.addIssue({ code: "custom", path: ["weekdays"], message: "pick at least one weekday" });
  });

export const timeZoneSchema = z.object({
  userId: z.string().min(1, "is required"),
  timeZone: z.string().refine((tz) => {
    try {
      new Intl.DateTimeFormat("en", { timeZone: tz });
      return tz.includes("/") || tz === "UTC";
    } catch {
      return false;
    }
  }, "an IANA zone such as Europe/Dublin"),
});

export const outboxResendSchema = z.object({ outboxId: z.coerce.number().int().positive("is required") });
