/** The roles of db/schema/users.ts, repeated so this module stays free of the database layer. */
type Role = "viewer" | "technician" | "engineer" | "manager" | "admin";

/*
 * The e-mails Ovenward sends on its own, what they are called in the settings, and whether they
 * go out on a schedule (an RRULE on the person's clock) or when something happens.
 */
export const MAIL_KIND_INFO = {
  fleet_digest: { label: "Weekly fleet digest", scheduled: true, about: "Every oven's state, runs out of window, overdue work and PM compliance." },
  my_work_daily: { label: "My work, each morning", scheduled: true, about: "The work orders assigned to you that are due or overdue." },
  drift_alert: { label: "Drift alerts", scheduled: false, about: "At once, when a drift rule fires on an oven." },
  calibration_due: { label: "Calibration due", scheduled: false, about: "30 and 7 days before an instrument's calibration lapses." },
  overdue_work: { label: "Overdue work orders", scheduled: false, about: "When a work order you hold (or your team holds) passes its due time." },
} as const;

export type MailKindName = keyof typeof MAIL_KIND_INFO;
export const MAIL_KIND_NAMES = Object.keys(MAIL_KIND_INFO) as MailKindName[];

export type SubscriptionDefault = { kind: MailKindName; enabled: boolean; weekdays?: string[]; sendAt?: string };

const WEEKDAYS_MO_FR = ["MO", "TU", "WE", "TH", "FR"];

/**
 * What each role gets until they choose otherwise: managers read Monday's digest, technicians
 * the morning list, engineers react to drift and calibration. Everything else starts off.
 */
export function defaultSubscriptionsFor(role: Role): SubscriptionDefault[] {
  const on = new Set<MailKindName>(
    {
      viewer: [] as MailKindName[],
      technician: ["my_work_daily", "overdue_work"] as MailKindName[],
      engineer: ["my_work_daily", "drift_alert", "calibration_due"] as MailKindName[],
      manager: ["fleet_digest", "drift_alert", "overdue_work"] as MailKindName[],
      admin: ["calibration_due"] as MailKindName[],
    }[role],
  );
  return MAIL_KIND_NAMES.map((kind) => {
    const base = { kind, enabled: on.has(kind) };
    if (kind === "fleet_digest") return { ...base, weekdays: ["MO"], sendAt: "07:30" };
    if (kind === "my_work_daily") return { ...base, weekdays: WEEKDAYS_MO_FR, sendAt: role === "technician" ? "06:45" : "07:00" };
    return base;
  });
}
